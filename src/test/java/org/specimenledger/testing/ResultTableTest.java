package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.specimenledger.reliability.CsvCells;
import org.specimenledger.reliability.HostileValues;

/** CSV cells: RFC 4180 quoting, and typed text that a spreadsheet would run as a formula defused. */
class ResultTableTest {

    @Test
    void typedTextStartingLikeAFormulaGetsAnApostrophe() {
        assertThat(ResultTable.typedText("=HYPERLINK(\"http://x\")")).isEqualTo("'=HYPERLINK(\"http://x\")");
        assertThat(ResultTable.typedText("+1")).isEqualTo("'+1");
        assertThat(ResultTable.typedText("-2+3")).isEqualTo("'-2+3");
        assertThat(ResultTable.typedText("@SUM(A1)")).isEqualTo("'@SUM(A1)");
        assertThat(ResultTable.typedText("\tx")).isEqualTo("'\tx");
        assertThat(ResultTable.typedText("NG-P12-T1")).isEqualTo("NG-P12-T1");
        assertThat(ResultTable.typedText("")).isEmpty();
    }

    @Test
    void quotingFollowsRfc4180() {
        assertThat(ResultTable.field("a,b")).isEqualTo("\"a,b\"");
        assertThat(ResultTable.field("say \"hi\"")).isEqualTo("\"say \"\"hi\"\"\"");
        assertThat(ResultTable.field(ResultTable.typedText("=1,2"))).isEqualTo("\"'=1,2\"");
        assertThat(ResultTable.field("plain")).isEqualTo("plain");
    }

    /**
     * Every hostile text of the reliability corpus, and the ways past a first-character filter, as a cell between two
     * others: read back with Commons CSV (RFC 4180) it is one cell again, equal to the text with an apostrophe in
     * front exactly when a spreadsheet would evaluate it ({@link CsvCells}, OWASP's list [CP]).
     */
    @Test
    void everyCorpusTextReadsBackAsOneCellThatNoSpreadsheetEvaluates() throws IOException {
        List<String> texts = new ArrayList<>(HostileValues.TEXT);
        texts.addAll(List.of("+1", "-1", "@A1", " =1+1", "  @SUM(A1)", "\n=1+1", "\r=1+1", "\t=1+1",
                "\uFF1D1+1", "\uFF0B1", "\uFF0D1", "\uFF20A1", "=1,2\r\n=3", "a\"b", "2.5", "-2.5"));
        for (String text : texts) {
            String line = "before," + ResultTable.field(ResultTable.typedText(text)) + ",after\r\n";
            List<CSVRecord> rows = CSVFormat.RFC4180.parse(new StringReader(line)).getRecords();
            assertThat(rows).as(text).hasSize(1);
            assertThat(rows.get(0).size()).as(text).isEqualTo(3);
            String cell = rows.get(0).get(1);
            assertThat(cell).as(text).isEqualTo(CsvCells.expected(text));
            assertThat(CsvCells.evaluated(cell)).as(text).isFalse();
        }
    }
}
