package org.specimenledger.testing;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.analysis.CyclicAnalysis;
import org.specimenledger.analysis.TensileAnalysis;
import org.specimenledger.jobs.JobView;
import org.specimenledger.jobs.Jobs;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * Re-analyses many test runs as one job, e.g. after a change of method: each run gets a new analysis through
 * {@link AnalysisService#reanalyse} (its own transaction and ledger events, the same reason for all), which
 * becomes its current one; nothing earlier is overwritten. A run that cannot be analysed is reported and the
 * job goes on.
 */
@Service
public class ReanalysisJobs {

    static final String KIND = "reanalysis";
    /** More runs than this in one job are refused: split the filter. */
    static final int MAX_RUNS = 10_000;

    /**
     * Which runs, with what and why. At least one of {@code testRunIds}, {@code orderId}, {@code heatId},
     * {@code testedFrom}, {@code testedTo} is needed; all given criteria must hold. Only runs with a stored curve
     * are taken, and only valid runs unless {@code includeInvalid}.
     *
     * @param onlyOlderMethod only runs whose current analysis was made by another method version than the
     *     running engine's
     * @param parameters the parameter set for every new analysis (missing keys: each run's defaults)
     */
    public record ReanalysisRequest(@Size(max = MAX_RUNS) List<UUID> testRunIds, UUID orderId, UUID heatId,
            LocalDate testedFrom, LocalDate testedTo, Boolean includeInvalid, Boolean onlyOlderMethod,
            @Size(max = 100) Map<String, Object> parameters, @NotNull @NotBlank @Size(max = 2000) String reason) {
    }

    private final AnalysisService analyses;
    private final JdbcClient jdbc;
    private final Jobs jobs;

    ReanalysisJobs(AnalysisService analyses, JdbcClient jdbc, Jobs jobs) {
        this.analyses = analyses;
        this.jdbc = jdbc;
        this.jobs = jobs;
    }

    /** Selects the runs and submits the job; 422 when none or too many match. */
    public JobView submit(ReanalysisRequest r) {
        List<UUID> runs = select(r);
        if (runs.isEmpty()) {
            throw new RuleViolation("/", "no test run with a stored curve matches the filter");
        }
        if (runs.size() > MAX_RUNS) {
            throw new RuleViolation("/", runs.size() + " test runs match; one job takes at most " + MAX_RUNS);
        }
        String reason = r.reason().trim();
        return jobs.submit(KIND, "re-analysis of " + runs.size() + " test runs: " + reason, runs.size(), reason,
                progress -> {
                    for (UUID id : runs) {
                        Map<String, Object> item = new LinkedHashMap<>();
                        item.put("testRunId", id);
                        try {
                            AnalysisRunView a = analyses.reanalyse(id,
                                    new TestRunRequests.AnalysisRequest(r.parameters(), reason));
                            item.put("analysisId", a.id());
                            item.put("methodVersion", a.methodVersion());
                            progress.succeeded(item);
                        } catch (RuntimeException refused) {
                            item.put("problem", CurveBatch.slugOf(refused));
                            item.put("detail", refused.getMessage());
                            progress.failed(item);
                        }
                    }
                    return Map.of("testRuns", runs.size());
                });
    }

    private List<UUID> select(ReanalysisRequest r) {
        boolean any = (r.testRunIds() != null && !r.testRunIds().isEmpty()) || r.orderId() != null
                || r.heatId() != null || r.testedFrom() != null || r.testedTo() != null;
        if (!any) {
            throw new RuleViolation(List.of(new FieldIssue("/", "give at least one of testRunIds, orderId, heatId, "
                    + "testedFrom, testedTo: a re-analysis of every run is not taken by accident")));
        }
        StringBuilder sql = new StringBuilder("""
                SELECT t.id FROM test_run t
                JOIN raw_curve c ON c.test_run_id = t.id
                JOIN specimen s ON s.id = t.specimen_id
                LEFT JOIN analysis_run a ON a.id = t.current_analysis_id
                WHERE TRUE""");
        Map<String, Object> params = new LinkedHashMap<>();
        if (r.testRunIds() != null && !r.testRunIds().isEmpty()) {
            sql.append(" AND t.id IN (:ids)");
            params.put("ids", r.testRunIds());
        }
        if (r.orderId() != null) {
            sql.append(" AND s.order_id = :order");
            params.put("order", r.orderId());
        }
        if (r.heatId() != null) {
            sql.append(" AND s.heat_id = :heat");
            params.put("heat", r.heatId());
        }
        if (r.testedFrom() != null) {
            sql.append(" AND t.test_date >= :from");
            params.put("from", r.testedFrom());
        }
        if (r.testedTo() != null) {
            sql.append(" AND t.test_date <= :to");
            params.put("to", r.testedTo());
        }
        if (!Boolean.TRUE.equals(r.includeInvalid())) {
            sql.append(" AND t.validity = 'VALID'");
        }
        if (Boolean.TRUE.equals(r.onlyOlderMethod())) {
            sql.append(" AND (a.id IS NULL OR (t.mode = 'TENSILE' AND a.method_version <> :tensile)"
                    + " OR (t.mode = 'CYCLIC' AND a.method_version <> :cyclic))");
            params.put("tensile", TensileAnalysis.METHOD_VERSION);
            params.put("cyclic", CyclicAnalysis.METHOD_VERSION);
        }
        sql.append(" ORDER BY t.created_at, t.id LIMIT ").append(MAX_RUNS + 1);
        return jdbc.sql(sql.toString()).params(params).query(UUID.class).list();
    }
}
