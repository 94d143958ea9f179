package dev.contour.sweep;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicLong;

/**
 * A sweep's results folder: {@code sweep.json} (which script, by path and SHA-256 of its text,
 * and which index set made the folder, with every tuple), and {@code records/}, one file per
 * finished tuple holding one JSON line. Every file is written to a temporary name in the same
 * folder and moved into place, so a reader sees a whole file or none; array tasks on a shared
 * file system never write the same file.
 */
final class ResultsFolder {
    static final String MANIFEST = "sweep.json";
    static final String FORMAT = "contour sweep results 1";
    private static final AtomicLong TEMP = new AtomicLong();

    /** What made a results folder. */
    record Manifest(String script, String scriptSha256, String over, String where, List<String> names, List<long[]> tuples) {
        Manifest {
            names = List.copyOf(names);
            tuples = List.copyOf(tuples);
        }

        String indexSet() {
            return where.isEmpty() ? over : over + " with " + where;
        }

        String toJson() {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("format", FORMAT);
            m.put("script", script);
            m.put("script_sha256", scriptSha256);
            m.put("over", over);
            m.put("where", where);
            m.put("names", names);
            List<Object> ts = new ArrayList<>();
            for (long[] t : tuples) {
                List<Object> one = new ArrayList<>();
                for (long x : t) {
                    one.add(x);
                }
                ts.add(one);
            }
            m.put("tuples", ts);
            return Json.write(m) + "\n";
        }

        static Manifest fromJson(String text) throws Json.Malformed {
            if (!(Json.read(text) instanceof Map<?, ?> m) || !FORMAT.equals(m.get("format"))) {
                throw new Json.Malformed("not a Contour sweep description (\"format\": \"" + FORMAT + "\")", 1);
            }
            if (!(m.get("script") instanceof String script) || !(m.get("script_sha256") instanceof String hash)
                    || !(m.get("over") instanceof String over) || !(m.get("where") instanceof String where)
                    || !(m.get("names") instanceof List<?> names) || !(m.get("tuples") instanceof List<?> tuples)) {
                throw new Json.Malformed("a field (script, script_sha256, over, where, names, tuples) is missing", 1);
            }
            List<String> ns = new ArrayList<>();
            for (Object n : names) {
                ns.add(String.valueOf(n));
            }
            List<long[]> ts = new ArrayList<>();
            for (Object t : tuples) {
                if (!(t instanceof List<?> one) || one.size() != ns.size()) {
                    throw new Json.Malformed("a tuple does not have one value per name", 1);
                }
                long[] x = new long[ns.size()];
                for (int i = 0; i < x.length; i++) {
                    if (!(one.get(i) instanceof Long v)) {
                        throw new Json.Malformed("a tuple value is not an integer", 1);
                    }
                    x[i] = v;
                }
                ts.add(x);
            }
            return new Manifest(script, hash, over, where, ns, ts);
        }

        Map<String, Long> tuple(int i) {
            Map<String, Long> m = new LinkedHashMap<>();
            for (int k = 0; k < names.size(); k++) {
                m.put(names.get(k), tuples.get(i)[k]);
            }
            return m;
        }
    }

    /** A record file that could not be read, with the reason. */
    record Damaged(Path file, String reason) { }

    /** Every record in the folder, and the files that are not valid records. */
    record Contents(Map<String, SweepRecord> records, List<Damaged> damaged) { }

    private final Path root;

    ResultsFolder(Path root) {
        this.root = root;
    }

    Path root() {
        return root;
    }

    Path records() {
        return root.resolve("records");
    }

    Path logs() {
        return root.resolve("logs");
    }

    /** The record file of a tuple: {@code records/p=3,q=1.json}. */
    Path recordFile(Map<String, Long> tuple) {
        return records().resolve(key(tuple) + ".json");
    }

    static String key(Map<String, Long> tuple) {
        StringBuilder out = new StringBuilder();
        tuple.forEach((k, v) -> out.append(out.length() == 0 ? "" : ",").append(k).append('=').append(v));
        return out.toString();
    }

    /** The folder's description, or null when it has none yet. */
    Manifest readManifest() throws IOException, Json.Malformed {
        try {
            return Manifest.fromJson(Files.readString(root.resolve(MANIFEST), StandardCharsets.UTF_8));
        } catch (NoSuchFileException e) {
            return null;
        }
    }

    void writeManifest(Manifest m) throws IOException {
        Files.createDirectories(records());
        writeWhole(root.resolve(MANIFEST), m.toJson());
    }

    void writeRecord(SweepRecord r) throws IOException {
        Files.createDirectories(records());
        writeWhole(recordFile(r.tuple()), r.toJson() + "\n");
    }

    /** Reads every {@code records/*.json}; temporary files of writers still at work are skipped. */
    Contents read() throws IOException {
        Map<String, SweepRecord> out = new LinkedHashMap<>();
        List<Damaged> damaged = new ArrayList<>();
        if (!Files.isDirectory(records())) {
            return new Contents(out, damaged);
        }
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> d = Files.newDirectoryStream(records(), "*.json")) {
            d.forEach(files::add);
        }
        files.sort(null);
        for (Path f : files) {
            String text;
            try {
                text = Files.readString(f, StandardCharsets.UTF_8);
            } catch (IOException e) {
                damaged.add(new Damaged(f, "cannot be read: " + e.getMessage()));
                continue;
            }
            String name = f.getFileName().toString();
            String key = name.substring(0, name.length() - ".json".length());
            try {
                if (text.isBlank()) {
                    throw new Json.Malformed("the file is empty", 1);
                }
                if (text.strip().contains("\n")) {
                    throw new Json.Malformed("a record file holds one line", 1);
                }
                SweepRecord r = SweepRecord.fromJson(text.strip());
                if (!key(r.tuple()).equals(key)) {
                    throw new Json.Malformed("it holds the record of " + key(r.tuple()) + ", not of its file name", 1);
                }
                out.put(key, r);
            } catch (Json.Malformed e) {
                damaged.add(new Damaged(f, e.getMessage() + " (column " + e.column + ")"));
            }
        }
        return new Contents(out, damaged);
    }

    /** Writes a file whole or not at all: a temporary file in the same folder, then an atomic move. */
    static void writeWhole(Path target, String text) throws IOException {
        Path dir = target.toAbsolutePath().getParent();
        Files.createDirectories(dir);
        Path tmp = dir.resolve("." + target.getFileName() + ".tmp-" + ProcessHandle.current().pid() + "-" + TEMP.incrementAndGet());
        try {
            Files.writeString(tmp, text, StandardCharsets.UTF_8);
            try {
                Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    static String sha256(String text) {
        return dev.contour.eval.Interpreter.sha256(text);
    }
}
