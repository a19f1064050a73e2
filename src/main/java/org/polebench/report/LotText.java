package org.polebench.report;

import java.io.PrintWriter;
import java.util.Locale;
import org.polebench.lot.ApartBoard;
import org.polebench.lot.GroupCounts;
import org.polebench.lot.LotFindings;
import org.polebench.lot.PartShift;
import org.polebench.lot.QuantityFindings;
import org.polebench.units.MeasuredValueFormat;

/** The readable summary of a lot, as {@code polebench lot} prints it: sentences first, then small tables. */
public final class LotText {

    public void write(LotFindings lot, PrintWriter out) {
        out.println(LotStatements.counts(lot));
        if (lot.boards() == 0) {
            return;
        }
        out.println();
        out.println("Lot findings");
        if (lot.systematic().isEmpty()) {
            out.println("  No part reads outside its tolerance across the lot.");
        }
        for (PartShift p : lot.systematic()) {
            out.println("  " + LotStatements.systematic(p));
        }
        boolean any = false;
        for (PartShift p : lot.parts()) {
            for (ApartBoard a : p.singleBoardFaults()) {
                if (!any) {
                    out.println();
                    out.println("Single-board faults");
                    any = true;
                }
                out.println("  " + LotStatements.singleBoard(p, a));
            }
        }
        for (QuantityFindings q : lot.quantities()) {
            out.println();
            out.println(LotStatements.capitalised(q.quantity().words()));
            out.println("  " + LotStatements.distribution(q));
            q.chart().ifPresent(c -> out.println("  " + LotStatements.chart(c)));
            q.capability().ifPresent(c -> out.println("  " + LotStatements.capability(c)));
            if (q.capability().isEmpty() && q.chart().isPresent()) {
                out.println("  No Cpk: the stage gives no limit for the " + q.quantity().words() + ".");
            }
        }
        out.println();
        out.println("Culprits");
        out.println("  " + LotStatements.culprits(lot));
        out.println();
        out.println("By station");
        counts(lot, out, true);
        out.println();
        out.println("By day (UTC)");
        counts(lot, out, false);
        out.println();
        out.println("Parts across the lot (pooled over the boards that identified each; DerSimonian-Laird)");
        out.println(String.format(Locale.ROOT, "  %-12s %9s %9s %7s %9s %8s  %s", "part", "factor", "u", "boards",
                "identified", "spread", "finding"));
        for (PartShift p : lot.parts()) {
            out.println(String.format(Locale.ROOT, "  %-12s %9s %9s %7d %9d %8s  %s", p.part(),
                    p.pooled().isPresent() ? "×" + LotStatements.factor(p.factor(), p.uFactor()) : "-",
                    p.pooled().isPresent() ? MeasuredValueFormat.uncertainty(p.uFactor()) : "-", p.boardsPooled(),
                    p.identifiable(), p.pooled().map(e -> MeasuredValueFormat.fixed(100 * e.tau(), 1) + " %").orElse("-"),
                    LotJson.finding(p.finding())));
        }
    }

    private static void counts(LotFindings lot, PrintWriter out, boolean stations) {
        out.println(String.format(Locale.ROOT, "  %-16s %7s %7s %7s %11s %14s %8s", stations ? "station" : "date",
                "boards", "passed", "failed", "incomplete", "input problem", "yield"));
        for (GroupCounts g : stations ? lot.byStation() : lot.byDay()) {
            out.println(String.format(Locale.ROOT, "  %-16s %7d %7d %7d %11d %14d %8s",
                    g.key().isEmpty() ? "(not given)" : g.key(), g.counts().boards(), g.counts().passed(),
                    g.counts().failed(), g.counts().incomplete(), g.counts().inputProblems(),
                    MeasuredValueFormat.percent(g.counts().yield(), 1)));
        }
    }
}
