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
    /** One timed workload: {@code body} runs once per repetition. */
    public record Workload(String name, String description, Runnable body) { }

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
