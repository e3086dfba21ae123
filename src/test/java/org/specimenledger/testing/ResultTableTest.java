package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

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
}
