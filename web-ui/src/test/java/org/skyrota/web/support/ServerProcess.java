package org.skyrota.web.support;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * The packaged server jar run as a separate process, as an operator runs it: started on a free port with a data
 * folder, waited for until {@code /actuator/health} answers, stopped politely or killed with SIGKILL
 * ({@link Process#destroyForcibly()} on Linux). Its output goes to a log file that tests can read.
 */
public final class ServerProcess implements AutoCloseable {

    public static final Duration START_TIMEOUT = Duration.ofMinutes(3);

    private final Process process;
    private final int port;
    private final Path log;

    private ServerProcess(Process process, int port, Path log) {
        this.process = process;
        this.port = port;
        this.log = log;
    }

    /** The jar failsafe hands over, or {@code target/skyrota.jar} when run from the module folder. */
    public static Path jar() {
        return Path.of(System.getProperty("skyrota.jar", "target/skyrota.jar"));
    }

    /** The moment the tests' servers start at (the same as test resources' config/application.properties). */
    public static final String TEST_CLOCK = "2026-12-01T12:00:00Z";

    public static int freePort() throws IOException {
        try (ServerSocket socket = new ServerSocket(0)) {
            return socket.getLocalPort();
        }
    }

    /** Starts the jar with {@code args} (port added), without waiting; {@code env} adds environment variables. */
    public static ServerProcess launch(Path log, Map<String, String> env, String... args) throws IOException {
        int port = freePort();
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<String> command = new ArrayList<>(List.of(java, "-Xmx512m", "-jar", jar().toString(), "--server.port=" + port));
        // The tests' own moment (as every in-process test has it), unless the caller names another: the nights the
        // tests plan lie ahead of it whenever the suite runs.
        if (Arrays.stream(args).noneMatch(a -> a.startsWith("--skyrota.clock="))) {
            command.add("--skyrota.clock=" + TEST_CLOCK);
        }
        command.addAll(List.of(args));
        ProcessBuilder builder = new ProcessBuilder(command).redirectErrorStream(true)
                .redirectOutput(ProcessBuilder.Redirect.appendTo(log.toFile()));
        builder.environment().putAll(env);
        return new ServerProcess(builder.start(), port, log);
    }

    /** Starts the jar on {@code dataDir} and waits until it is healthy. */
    public static ServerProcess start(Path dataDir, Path log, Map<String, String> env, String... extraArgs) throws Exception {
        List<String> args = new ArrayList<>(List.of("--skyrota.data-dir=" + dataDir));
        args.addAll(List.of(extraArgs));
        ServerProcess server = launch(log, env, args.toArray(String[]::new));
        server.awaitHealthy();
        return server;
    }

    public void awaitHealthy() throws Exception {
        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();
        Instant deadline = Instant.now().plus(START_TIMEOUT);
        while (Instant.now().isBefore(deadline)) {
            if (!process.isAlive()) {
                throw new AssertionError("server exited early with " + process.exitValue() + "; log:\n" + log());
            }
            try {
                HttpResponse<String> r = http.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + "/actuator/health"))
                        .timeout(Duration.ofSeconds(5)).build(), HttpResponse.BodyHandlers.ofString());
                if (r.statusCode() == 200) {
                    return;
                }
            } catch (IOException notYet) {
                // not listening yet
            }
            Thread.sleep(250);
        }
        throw new AssertionError("server not healthy within " + START_TIMEOUT + "; log:\n" + log());
    }

    public int port() {
        return port;
    }

    public long pid() {
        return process.pid();
    }

    public Process process() {
        return process;
    }

    /** SIGKILL: no shutdown hook runs, nothing is flushed or closed by the server. */
    public void kill() throws InterruptedException {
        process.destroyForcibly();
        if (!process.waitFor(30, TimeUnit.SECONDS)) {
            throw new AssertionError("server " + process.pid() + " did not die on SIGKILL");
        }
    }

    /** Waits for the process to end by itself and answers its exit code. */
    public int awaitExit(Duration timeout) throws InterruptedException {
        if (!process.waitFor(timeout.toMillis(), TimeUnit.MILLISECONDS)) {
            process.destroyForcibly();
            throw new AssertionError("server still running after " + timeout + "; log:\n" + log());
        }
        return process.exitValue();
    }

    public String log() {
        try {
            return Files.readString(log);
        } catch (IOException e) {
            return "(no log: " + e.getMessage() + ")";
        }
    }

    /** SIGTERM, then SIGKILL if it does not stop within 30 s. */
    @Override
    public void close() throws InterruptedException {
        if (process.isAlive()) {
            process.destroy();
            if (!process.waitFor(30, TimeUnit.SECONDS)) {
                process.destroyForcibly();
                process.waitFor(10, TimeUnit.SECONDS);
            }
        }
    }
}
