package dev.contour.sweep;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;

/**
 * Runs tuples on a pool of worker processes ({@link SweepWorker}), each a JVM with its own heap
 * limit that runs many tuples one after another. A worker that dies (out of memory, killed) or
 * overruns the per-tuple time costs only its tuple: the pool records the tuple as an error and
 * starts a fresh worker for the rest.
 */
final class WorkerPool {
    /** How workers start and how long a tuple may take before its worker is stopped. */
    record Settings(List<String> javaCommand, List<String> workerArguments, int jobs, Duration tupleTimeout, String memoryNote,
                    String timeNote) { }

    private static final String END = "\u0000end";
    /** How long a worker may take to start and warm up before the sweep gives up on it. */
    private static final Duration STARTUP = Duration.ofSeconds(300);

    private final Settings settings;
    private final ResultsFolder folder;
    private final ResultsFolder.Manifest manifest;
    private final List<Process> live = Collections.synchronizedList(new ArrayList<>());

    WorkerPool(Settings settings, ResultsFolder folder, ResultsFolder.Manifest manifest) {
        this.settings = settings;
        this.folder = folder;
        this.manifest = manifest;
    }

    /** Runs the tuples at these positions of the manifest; returns when every one has a record. */
    void run(List<Integer> todo, SweepProgress progress) throws InterruptedException {
        ConcurrentLinkedQueue<Integer> queue = new ConcurrentLinkedQueue<>(todo);
        Thread stopper = new Thread(this::stopAll, "contour-sweep-stop");
        Runtime.getRuntime().addShutdownHook(stopper);
        List<Thread> slots = new ArrayList<>();
        List<Throwable> problems = Collections.synchronizedList(new ArrayList<>());
        for (int k = 0; k < Math.min(settings.jobs(), todo.size()); k++) {
            int slot = k;
            Thread t = new Thread(() -> {
                try {
                    new Slot(slot).drain(queue, progress);
                } catch (IOException | RuntimeException e) {
                    problems.add(e);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }, "contour-sweep-slot-" + k);
            slots.add(t);
            t.start();
        }
        try {
            for (Thread t : slots) {
                t.join();
            }
        } finally {
            stopAll();
            try {
                Runtime.getRuntime().removeShutdownHook(stopper);
            } catch (IllegalStateException e) {
                // the JVM is already shutting down; the hook runs anyway
            }
        }
        if (!problems.isEmpty()) {
            throw new IllegalStateException("a sweep worker slot failed: " + problems.get(0), problems.get(0));
        }
    }

    private void stopAll() {
        synchronized (live) {
            for (Process p : live) {
                p.descendants().forEach(ProcessHandle::destroyForcibly);
                p.destroyForcibly();
            }
        }
    }

    /** One worker at a time, replaced when it dies. */
    private final class Slot {
        private final int number;
        private Process process;
        private Writer toWorker;
        private BlockingQueue<String> fromWorker;

        Slot(int number) {
            this.number = number;
        }

        void drain(ConcurrentLinkedQueue<Integer> queue, SweepProgress progress) throws IOException, InterruptedException {
            try {
                for (Integer index = queue.poll(); index != null; index = queue.poll()) {
                    progress.started();
                    SweepRecord.Status status = runOne(index);
                    progress.finished(status == SweepRecord.Status.OK);
                }
            } finally {
                retire();
            }
        }

        private SweepRecord.Status runOne(int index) throws IOException, InterruptedException {
            Map<String, Long> tuple = manifest.tuple(index);
            Path file = folder.recordFile(tuple);
            FileTime sent = FileTime.fromMillis(System.currentTimeMillis() - 1000);
            if (process == null || !process.isAlive()) {
                start();
            }
            try {
                toWorker.write(index + "\n");
                toWorker.flush();
            } catch (IOException e) {
                start(); // the worker died between tuples: one fresh start, then an error is an error
                toWorker.write(index + "\n");
                toWorker.flush();
            }
            sent = FileTime.fromMillis(System.currentTimeMillis() - 1000);
            long timeout = settings.tupleTimeout().toMillis();
            String answer = fromWorker.poll(timeout, TimeUnit.MILLISECONDS);
            if (answer != null && answer.equals("done " + index)) {
                return statusOf(file, tuple);
            }
            if (answer != null && answer.equals("done " + index + " " + SweepWorker.EXITING)) {
                retire(); // the next tuple goes to a fresh worker
                return statusOf(file, tuple);
            }
            String why;
            if (answer == null) {
                process.descendants().forEach(ProcessHandle::destroyForcibly);
                process.destroyForcibly();
                process.waitFor(10, TimeUnit.SECONDS);
                why = "the tuple ran past its time limit and its worker was stopped after "
                        + settings.tupleTimeout().toSeconds() + " s (" + settings.timeNote() + ")";
            } else {
                process.waitFor(10, TimeUnit.SECONDS);
                int code = process.isAlive() ? -1 : process.exitValue();
                if (Files.exists(file) && Files.getLastModifiedTime(file).compareTo(sent) >= 0) {
                    return statusOf(file, tuple); // the record was written just before the worker ended
                }
                why = "the worker process running this tuple ended with exit status " + code
                        + (code == SweepWorker.EXIT_MEMORY || code == 137 || code == 134
                        ? " (most likely out of memory: " + settings.memoryNote() + ")" : "")
                        + "; its log is in " + folder.logs();
            }
            retire();
            SweepRecord r = new SweepRecord(tuple, SweepRecord.Status.ERROR, why + "\n", List.of(), "", 0, 0, 0, -1, Map.of());
            folder.writeRecord(r);
            return r.status();
        }

        private SweepRecord.Status statusOf(Path file, Map<String, Long> tuple) {
            try {
                return SweepRecord.fromJson(Files.readString(file, StandardCharsets.UTF_8).strip()).status();
            } catch (IOException | Json.Malformed e) {
                return SweepRecord.Status.ERROR; // reported by name when the folder is read for the table
            }
        }

        private void start() throws IOException, InterruptedException {
            retire();
            Files.createDirectories(folder.logs());
            List<String> command = new ArrayList<>(settings.javaCommand());
            command.add(SweepWorker.class.getName());
            command.addAll(settings.workerArguments());
            ProcessBuilder b = new ProcessBuilder(command);
            // the worker's threads come from its -XX:ActiveProcessorCount, not the sweep's own setting
            b.environment().remove(dev.contour.Parallel.THREADS_VARIABLE);
            b.redirectError(ProcessBuilder.Redirect.appendTo(folder.logs().resolve(
                    "worker-" + ProcessHandle.current().pid() + "-" + number + ".log").toFile()));
            process = b.start();
            live.add(process);
            toWorker = new OutputStreamWriter(process.getOutputStream(), StandardCharsets.UTF_8);
            BlockingQueue<String> lines = new LinkedBlockingQueue<>();
            fromWorker = lines;
            Process p = process;
            Thread reader = new Thread(() -> {
                try (BufferedReader r = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
                    for (String line = r.readLine(); line != null; line = r.readLine()) {
                        lines.add(line);
                    }
                } catch (IOException e) {
                    // the worker is gone; the END marker below says so
                }
                lines.add(END);
            }, "contour-sweep-reader-" + number);
            reader.setDaemon(true);
            reader.start();
            String hello = lines.poll(STARTUP.toMillis(), TimeUnit.MILLISECONDS);
            if (!"ready".equals(hello)) {
                process.destroyForcibly();
                throw new IOException("a sweep worker did not start within " + STARTUP.toSeconds() + " s"
                        + (hello == null || hello.equals(END) ? "" : " (it said: " + hello + ")") + "; its log is in " + folder.logs());
            }
        }

        private void retire() throws InterruptedException {
            if (process == null) {
                return;
            }
            try {
                toWorker.close(); // end of input: the worker finishes and exits
            } catch (IOException e) {
                // already gone
            }
            if (!process.waitFor(10, TimeUnit.SECONDS)) {
                process.destroyForcibly();
                process.waitFor(10, TimeUnit.SECONDS);
            }
            live.remove(process);
            process = null;
        }
    }
}
