package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.polebench.lot.LotFindings;

class LotTextTest {
    private static String text(LotFindings lot) {
        StringWriter s = new StringWriter();
        new LotText().write(lot, new PrintWriter(s));
        return s.toString();
    }

    @Test
    void theSummaryNamesTheLotFindingApartFromTheSingleBoardFault() {
        String text = text(DemoLot.findings());
        assertTrue(text.startsWith("Lot HP-lot-7: 40 boards;"), text);
        assertTrue(text.contains("C2 reads ×0."), text);
        assertTrue(text.contains("a lot finding"), text);
        assertTrue(text.contains("Board HP-012: C3 reads ×0.09"), text);
        assertTrue(text.contains("Western Electric"), text);
        assertTrue(text.contains("one-sided, Cpu"), text);
    }

    @Test
    void theTextDoesNotDependOnTheDefaultLocale() {
        // a German default locale writes 0,68 where String.format is not given Locale.ROOT
        Locale before = Locale.getDefault();
        String root = text(DemoLot.findings());
        try {
            Locale.setDefault(Locale.GERMANY);
            assertEquals(root, text(DemoLot.findings()));
        } finally {
            Locale.setDefault(before);
        }
    }
}
