package dev.contour.cli;

import java.util.Collections;
import java.util.Map;
import java.util.ServiceLoader;
import java.util.TreeMap;

/**
 * The workloads {@code contour bench NAME} can time. Packages add theirs through a
 * {@link Provider} listed in {@code META-INF/services/dev.contour.cli.BenchRegistry$Provider}.
 */
public final class BenchRegistry {
    /**
     * One workload. A timed one ({@code report == null}) runs {@code body} once per repetition; a
     * report times its own steps and prints a table, so it runs once.
     */
    public record Workload(String name, String description, Runnable body, java.util.function.Consumer<java.io.PrintStream> report) {
        public Workload(String name, String description, Runnable body) {
            this(name, description, body, null);
        }

        /** A workload that prints its own table of figures. */
        public static Workload report(String name, String description, java.util.function.Consumer<java.io.PrintStream> report) {
            return new Workload(name, description, () -> report.accept(new java.io.PrintStream(java.io.OutputStream.nullOutputStream())), report);
        }
    }

    /** Contributes workloads. */
    public interface Provider {
        void register(BenchRegistry registry);
    }

    private final Map<String, Workload> workloads = new TreeMap<>();

    /** The built-in workloads plus those of every provider on the class path. */
    public static BenchRegistry standard() {
        BenchRegistry r = new BenchRegistry();
        CoreBenchmarks.register(r);
        for (Provider p : ServiceLoader.load(Provider.class)) {
            p.register(r);
        }
        return r;
    }

    public BenchRegistry register(Workload w) {
        if (workloads.putIfAbsent(w.name(), w) != null) {
            throw new IllegalStateException("benchmark '" + w.name() + "' registered twice");
        }
        return this;
    }

    public Map<String, Workload> all() {
        return Collections.unmodifiableMap(workloads);
    }
}
