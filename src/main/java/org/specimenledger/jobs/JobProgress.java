package org.specimenledger.jobs;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * What a running job reports: each item as it is through, succeeded or failed, with its own details. Every
 * report is written to the job's row at once, so a user polling the job sees it move.
 */
public final class JobProgress {

    private final Jobs jobs;
    private final java.util.UUID jobId;
    private final List<Map<String, Object>> items = new ArrayList<>();
    private int total;
    private int succeeded;
    private int failed;

    JobProgress(Jobs jobs, java.util.UUID jobId, int total) {
        this.jobs = jobs;
        this.jobId = jobId;
        this.total = total;
    }

    /** Corrects the number of items when the work learns it only after starting. */
    public void total(int total) {
        this.total = total;
        write(null);
    }

    /** One item went through; {@code details} says which and what came of it. */
    public void succeeded(Map<String, Object> details) {
        succeeded++;
        add("SUCCEEDED", details);
    }

    /** One item failed without stopping the rest; {@code details} says which and why. */
    public void failed(Map<String, Object> details) {
        failed++;
        add("FAILED", details);
    }

    private void add(String outcome, Map<String, Object> details) {
        Map<String, Object> item = new LinkedHashMap<>();
        item.put("outcome", outcome);
        item.putAll(details);
        items.add(item);
        write(null);
    }

    void write(Map<String, Object> answer) {
        Map<String, Object> summary = new LinkedHashMap<>();
        if (answer != null) {
            summary.putAll(answer);
        }
        summary.put("items", items);
        jobs.progress(jobId, items.size(), Math.max(total, items.size()), succeeded, failed, summary);
    }

    int done() {
        return items.size();
    }
}
