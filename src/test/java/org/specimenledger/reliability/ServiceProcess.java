package org.specimenledger.reliability;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;

/**
 * The service as a separate operating-system process, so that it can be killed as a power cut would kill it:
 * {@link Process#destroyForcibly()} sends SIGKILL on Linux (no shutdown hook, no graceful close). Started from
 * the built jar when {@code -Dreliability.jar=target/specimen-ledger.jar} names an existing one, else from this JVM's class
 * path with the same main class. Its own port, data folder and database; its output goes to a log file.
 */
final class ServiceProcess implements AutoCloseable {

    private final Path dataDir;
    private final String databaseUrl;
    private final int port;
    private final Path log;
    private Process process;
    private int starts;
    private int hashStrength = 4;
    private final java.util.Map<String, String> environment = new java.util.HashMap<>();
    /** Fast start for the crash tests, which restart the service dozens of times: small heap, C1 compiler only. */
    private List<String> jvmOptions = List.of("-Xmx512m", "-XX:TieredStopAtLevel=1");

    /** bcrypt work factor of the started service: 4 (fast) for the crash tests, the production 11 for load. */
    ServiceProcess hashStrength(int strength) {
        this.hashStrength = strength;
        return this;
    }

    /** Replaces the JVM options of the started service (e.g. the full JIT and a larger heap for the load run). */
    ServiceProcess jvmOptions(List<String> options) {
        this.jvmOptions = List.copyOf(options);
        return this;
    }

    /** One more environment variable for the started service. */
    ServiceProcess env(String name, String value) {
        environment.put(name, value);
        return this;
    }

    ServiceProcess(Path dataDir, String databaseUrl) throws IOException {
        this.dataDir = dataDir;
        this.databaseUrl = databaseUrl;
        this.port = freePort();
        this.log = dataDir.resolve("service.log");
        Files.createDirectories(dataDir);
    }

    int port() {
        return port;
    }

    Path log() {
        return log;
    }

    /** Starts the service and waits until its health endpoint says UP. */
    void start(Duration patience) throws IOException, InterruptedException {
        List<String> command = new ArrayList<>();
        command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        command.addAll(jvmOptions);
        command.add("-Dledger.password-hash-strength=" + hashStrength);
        // the machine's PostgreSQL is shared with other builds: a small pool leaves connections for them
        command.add("-Dledger.db.pool-size=" + Integer.getInteger("reliability.pool-size", 8));
        String jar = System.getProperty("reliability.jar");
        if (jar != null && !jar.isBlank() && Files.isRegularFile(Path.of(jar))) {
            command.add("-jar");
            command.add(Path.of(jar).toAbsolutePath().toString());
        } else {
            command.add("-cp");
            command.add(System.getProperty("java.class.path"));
            command.add("org.specimenledger.SpecimenLedgerApplication");
        }
        ProcessBuilder builder = new ProcessBuilder(command);
        builder.environment().put("LEDGER_PORT", Integer.toString(port));
        builder.environment().put("LEDGER_DATA_DIR", dataDir.toString());
        builder.environment().put("LEDGER_DB_URL", databaseUrl);
        builder.environment().put("LEDGER_DB_USER", "");
        builder.environment().put("LEDGER_DB_PASSWORD", "");
        builder.environment().put("LEDGER_DEMO", "on");
        builder.environment().putAll(environment);
        builder.redirectErrorStream(true);
        builder.redirectOutput(ProcessBuilder.Redirect.appendTo(log.toFile()));
        Files.writeString(log, "\n===== start " + (++starts) + " =====\n", java.nio.file.StandardOpenOption.CREATE,
                java.nio.file.StandardOpenOption.APPEND);
        process = builder.start();
        long deadline = System.nanoTime() + patience.toNanos();
        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(2)).build();
        while (System.nanoTime() < deadline) {
            if (!process.isAlive()) {
                throw new IllegalStateException("the service exited with " + process.exitValue() + " during start; see "
                        + log);
            }
            try {
                HttpResponse<String> r = http.send(HttpRequest.newBuilder(URI.create(base() + "/actuator/health"))
                        .timeout(Duration.ofSeconds(2)).build(), HttpResponse.BodyHandlers.ofString());
                if (r.statusCode() == 200 && r.body().contains("UP")) {
                    return;
                }
            } catch (IOException e) {
                // not listening yet
            }
            Thread.sleep(250);
        }
        throw new IllegalStateException("the service did not become healthy within " + patience + "; see " + log);
    }

    /** CPU time the service process has used so far (all its threads), as the operating system counts it. */
    Duration cpuTime() {
        return process.toHandle().info().totalCpuDuration().orElse(Duration.ZERO);
    }

    String base() {
        return "http://127.0.0.1:" + port;
    }

    /** SIGKILL, then waits until the process is gone. */
    void kill() throws InterruptedException {
        if (process != null && process.isAlive()) {
            process.destroyForcibly();
            process.waitFor();
        }
    }

    @Override
    public void close() throws InterruptedException {
        if (process != null && process.isAlive()) {
            process.destroy();
            if (!process.waitFor(20, java.util.concurrent.TimeUnit.SECONDS)) {
                kill();
            }
        }
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }
}
