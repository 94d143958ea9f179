package dev.contour.cli;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;

/** {@code contour bench}: lists workloads, or times one (warm-up runs, then the best and median of timed runs). */
final class Bench {
    private Bench() { }

    static int run(List<String> args, PrintStream out, PrintStream err) {
        Map<String, BenchRegistry.Workload> all = BenchRegistry.standard().all();
        if (args.isEmpty()) {
            out.println("benchmark workloads (contour bench NAME [REPEATS]):");
            int width = all.keySet().stream().mapToInt(String::length).max().orElse(4);
            all.values().forEach(w -> out.printf("  %-" + width + "s  %s%n", w.name(), w.description()));
            return Main.OK;
        }
        BenchRegistry.Workload w = all.get(args.get(0));
        if (w == null) {
            err.println("contour: no benchmark named '" + args.get(0) + "' (run 'contour bench' for the list)");
            return Main.BAD_INPUT;
        }
        if (w.report() != null) {
            try {
                w.report().accept(out);
            } catch (dev.contour.ContourException e) {
                err.println("contour: " + e.getMessage()); // a bad CONTOUR_*_P list, say
                return Main.BAD_INPUT;
            }
            return Main.OK;
        }
        int repeats;
        try {
            repeats = args.size() > 1 ? Integer.parseInt(args.get(1)) : 10;
        } catch (NumberFormatException e) {
            err.println("contour: REPEATS must be a number, not '" + args.get(1) + "'");
            return Main.BAD_INPUT;
        }
        for (int i = 0; i < Math.max(1, repeats / 3); i++) {
            w.body().run();
        }
        List<Double> ms = new ArrayList<>();
        for (int i = 0; i < Math.max(1, repeats); i++) {
            long t0 = System.nanoTime();
            w.body().run();
            ms.add((System.nanoTime() - t0) / 1e6);
        }
        Collections.sort(ms);
        out.printf("%s: best %.2f ms, median %.2f ms over %d runs%n", w.name(), ms.get(0), ms.get(ms.size() / 2), ms.size());
        return Main.OK;
    }
}
