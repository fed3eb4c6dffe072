package org.skyrota.bench;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.SecureRandom;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Base64;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicLongArray;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * load: the packaged server ({@code web-ui/target/skyrota.jar}, its own JVM, embedded H2 in a fresh folder) under
 * {@code --clients} concurrent clients (default 100) for {@code --seconds} (default 60) on loopback. Each client is
 * one requester with a browser session (signed in once with the form; the session cookie and CSRF token on every
 * call), so that bcrypt runs once per client instead of on every call as HTTP Basic would. The mix: 20% request
 * submissions ({@code POST /api/requests}), 50% queue reads ({@code GET /api/requests?page=}), 30% reads of the
 * published plan ({@code GET /api/plans/published}), published beforehand from a short planner run. A warm-up
 * ({@code --warmup}, 60 s by default; the same mix, not counted) comes first: on two cores the server's JIT
 * compiler is still busy after a minute, and a shorter warm-up measures the compiler more than the server.
 * Afterwards every acknowledged submission, warm-up ones included, is read back by id; {@code lost} counts those
 * missing or changed. {@code errors} counts answers other than 2xx and calls that got no answer.
 *
 * <p>Each client sends {@code --pace} calls a second (5 by default, 500 a second from 100 clients) on a fixed
 * schedule, and a call's latency counts from when it was due, so that a server that falls behind cannot hide its
 * queue by slowing the clients down. {@code --pace=0} sends each call as soon as the last is answered instead: that
 * measures how many calls a second the server can answer, but then the latency is the clients' queue (100 calls
 * always in flight at R calls a second wait 100/R s on average, Little's law). {@code --mix=S,Q} sets the
 * percentages of submissions and queue reads (the rest are plan reads), to measure one kind of call alone. Stderr
 * traces the calls a second every 10 s and, at the end, the slowest call of each measured second.
 */
public final class LoadBench {

    private static final Pattern ID = Pattern.compile("\"id\"\\s*:\\s*(\\d+)");
    private static final Pattern COOKIE = Pattern.compile("^([^=;]+)=([^;]*)");
    private static final AtomicLong CALLS = new AtomicLong();

    /** Percentages of the calls that submit a request and that read the queue; the rest read the published plan. */
    record Mix(int submissions, int queueReads) {
        int planReads() {
            return 100 - submissions - queueReads;
        }
    }

    public static void main(String[] args) throws Exception {
        Map<String, String> opts = options(args);
        int clients = Integer.parseInt(opts.getOrDefault("clients", "100"));
        int seconds = Integer.parseInt(opts.getOrDefault("seconds", "60"));
        // The server's JIT compiler shares the two cores with the load and takes about a minute to settle (the trace
        // on stderr shows it), so the default warm-up is 60 s; the BENCH line says which was used.
        int warmupSeconds = Integer.parseInt(opts.getOrDefault("warmup", "60"));
        // 0: closed loop, every client sends its next call as soon as the last is answered. Above 0: each client
        // sends that many calls a second on a fixed schedule, as a person or a script with think time does.
        double pace = Double.parseDouble(opts.getOrDefault("pace", "5"));
        // Percentages of submissions and queue reads; the rest are plan reads. Other mixes isolate one kind of call.
        String[] shares = opts.getOrDefault("mix", "20,50").split(",");
        Mix mix = new Mix(Integer.parseInt(shares[0].trim()), Integer.parseInt(shares[1].trim()));
        Path jar = Path.of(opts.getOrDefault("jar", "web-ui/target/skyrota.jar"));
        if (!Files.isRegularFile(jar)) {
            throw new IllegalStateException("no server jar at " + jar.toAbsolutePath() + "; build it with mvn -pl web-ui -am package");
        }
        Path data = Files.createTempDirectory("skyrota-load-");
        String adminPassword = randomPassword();
        int port;
        try (ServerSocket s = new ServerSocket(0)) {
            port = s.getLocalPort();
        }
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        ProcessBuilder pb = new ProcessBuilder(java, "-Xmx1g", "-jar", jar.toString(), "--server.port=" + port,
                "--skyrota.data-dir=" + data.resolve("db"), "--logging.level.root=WARN")
                .redirectErrorStream(true).redirectOutput(data.resolve("server.log").toFile());
        pb.environment().put("SKYROTA_ADMIN_PASSWORD", adminPassword);
        Process server = pb.start();
        ExecutorService pool = Executors.newFixedThreadPool(clients, r -> {
            Thread t = new Thread(r, "load-client");
            t.setDaemon(true);
            return t;
        });
        try {
            HttpClient http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
                    .connectTimeout(Duration.ofSeconds(5)).executor(Executors.newFixedThreadPool(4, r -> {
                        Thread t = new Thread(r, "load-http");
                        t.setDaemon(true); // the program ends when the clients are done
                        return t;
                    })).build();
            String base = "http://127.0.0.1:" + port;
            awaitHealthy(http, base, server, data.resolve("server.log"));
            Setup setup = Setup.make(http, base, adminPassword, clients);
            System.err.printf(Locale.ROOT, "load: server up on port %d, %d clients signed in, published plan with %d visits%n",
                    port, clients, setup.publishedVisits);

            ConcurrentLinkedQueue<long[]> acknowledged = new ConcurrentLinkedQueue<>();
            // Calls a second in each 10 s, warm-up included, on stderr: shows when the server's JIT has settled.
            Thread trace = new Thread(() -> {
                long last = 0;
                for (int t = 10; ; t += 10) {
                    try {
                        Thread.sleep(10_000);
                    } catch (InterruptedException e) {
                        return;
                    }
                    long now = CALLS.get();
                    System.err.printf(Locale.ROOT, "load: %4d s %7.1f calls/s%n", t, (now - last) / 10.0);
                    last = now;
                }
            }, "load-trace");
            trace.setDaemon(true);
            trace.start();
            phase(pool, setup, clients, warmupSeconds, pace, mix, acknowledged, null);
            Stats stats = new Stats(seconds);
            long start = System.nanoTime();
            phase(pool, setup, clients, seconds, pace, mix, acknowledged, stats);
            double elapsed = (System.nanoTime() - start) / 1e9;

            long lost = verify(pool, setup, acknowledged);
            long[] latencies = stats.latencies();
            Arrays.sort(latencies);
            System.err.printf(Locale.ROOT, "load: %d calls (%d submissions, %d queue reads, %d plan reads), %d acknowledged submissions checked%n",
                    latencies.length, stats.submissions.get(), stats.queueReads.get(), stats.planReads.get(), acknowledged.size());
            StringBuilder slowest = new StringBuilder();
            for (int i = 0; i < seconds; i++) {
                slowest.append(' ').append(stats.slowestPerSecond.get(i) / 1_000_000);
            }
            System.err.println("load: slowest call of each second, ms:" + slowest);
            System.out.printf(Locale.ROOT, "BENCH load requestsPerSecond=%.1f p50Ms=%.2f p99Ms=%.2f errors=%d lost=%d clients=%d seconds=%d"
                            + " submissions=%d acknowledged=%d pacePerClient=%s mix=%d,%d,%d warmupSeconds=%d%n",
                    latencies.length / elapsed, percentile(latencies, 0.50) / 1e6, percentile(latencies, 0.99) / 1e6,
                    stats.errors.get(), lost, clients, seconds, stats.submissions.get(), acknowledged.size(),
                    pace > 0 ? String.format(Locale.ROOT, "%.1f", pace) : "closed-loop", mix.submissions(),
                    mix.queueReads(), mix.planReads(), warmupSeconds);
        } finally {
            pool.shutdownNow();
            server.destroy();
            if (!server.waitFor(30, TimeUnit.SECONDS)) {
                server.destroyForcibly();
            }
        }
    }

    /** One signed-in client: its user name and the cookies of its session. */
    static final class Client {
        final String username;
        final Map<String, String> cookies = new java.util.concurrent.ConcurrentHashMap<>();

        Client(String username) {
            this.username = username;
        }

        HttpRequest.Builder request(String base, String path) {
            HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + path)).timeout(Duration.ofSeconds(30));
            if (!cookies.isEmpty()) {
                StringBuilder c = new StringBuilder();
                cookies.forEach((k, v) -> c.append(c.length() == 0 ? "" : "; ").append(k).append('=').append(v));
                b.header("Cookie", c.toString());
            }
            String xsrf = cookies.get("XSRF-TOKEN");
            if (xsrf != null) {
                b.header("X-XSRF-TOKEN", xsrf);
            }
            return b;
        }

        HttpResponse<String> send(HttpClient http, HttpRequest request) throws IOException, InterruptedException {
            HttpResponse<String> r = http.send(request, HttpResponse.BodyHandlers.ofString());
            for (String set : r.headers().allValues("Set-Cookie")) {
                Matcher m = COOKIE.matcher(set);
                if (m.find()) {
                    if (m.group(2).isEmpty() || set.toLowerCase(Locale.ROOT).contains("max-age=0")) {
                        cookies.remove(m.group(1));
                    } else {
                        cookies.put(m.group(1), m.group(2));
                    }
                }
            }
            return r;
        }

        /** The form sign-in a browser does: a CSRF cookie first, then the form, then one call that sets the new token. */
        void signIn(HttpClient http, String base, String password) throws IOException, InterruptedException {
            send(http, request(base, "/api/about").GET().build());
            String form = "username=" + URLEncoder.encode(username, StandardCharsets.UTF_8) + "&password="
                    + URLEncoder.encode(password, StandardCharsets.UTF_8);
            HttpResponse<String> login = send(http, request(base, "/login")
                    .header("Content-Type", "application/x-www-form-urlencoded").POST(HttpRequest.BodyPublishers.ofString(form)).build());
            String location = login.headers().firstValue("Location").orElse("");
            if (login.statusCode() != 302 || location.contains("error")) {
                throw new IllegalStateException("sign-in of " + username + " failed: " + login.statusCode() + " " + location);
            }
            HttpResponse<String> me = send(http, request(base, "/api/accounts/me").GET().build());
            if (me.statusCode() != 200 || !cookies.containsKey("XSRF-TOKEN")) {
                throw new IllegalStateException("session of " + username + " not usable: " + me.statusCode() + " " + cookies.keySet());
            }
        }
    }

    /** The accounts, program and published plan the load runs against. */
    static final class Setup {
        HttpClient http;
        String base;
        long programId;
        List<Client> clients = new ArrayList<>();
        int publishedVisits;

        static Setup make(HttpClient http, String base, String adminPassword, int clientCount) throws Exception {
            Setup s = new Setup();
            s.http = http;
            s.base = base;
            String admin = basic("admin", adminPassword);
            long site = id(call(http, base, "POST", "/api/sites", admin, "{\"name\":\"Load test hill\",\"latitudeDeg\":45,"
                    + "\"longitudeDeg\":7,\"elevationM\":500,\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5}", 201));
            long telescope = id(call(http, base, "POST", "/api/telescopes", admin, "{\"siteId\":" + site + ",\"name\":\"L40\","
                    + "\"apertureMm\":400,\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}", 201));
            call(http, base, "POST", "/api/instruments", admin, "{\"telescopeId\":" + telescope + ",\"name\":\"LCCD\","
                    + "\"readoutSeconds\":5,\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"B\",\"V\",\"R\"]}", 201);
            s.programId = id(call(http, base, "POST", "/api/programs", admin, "{\"code\":\"LOAD\",\"title\":\"Load test\","
                    + "\"principalInvestigator\":\"Dr. Test\",\"active\":true,\"grants\":[{\"telescopeId\":" + telescope
                    + ",\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}", 201));
            // One requester account per client; passwords known only to this run.
            String password = randomPassword();
            for (int i = 0; i < clientCount; i++) {
                call(http, base, "POST", "/api/accounts", admin, "{\"username\":\"load" + i + "\",\"password\":\"" + password
                        + "\",\"role\":\"requester\"}", 201);
            }
            // A published plan to read: accepted requests on January 2027 evenings at 45° N (invented demo targets,
            // spread in RA so that most are up), one short planner run, published.
            for (int i = 0; i < 24; i++) {
                double ra = 20 + i * 6.0;
                String body = "{\"programId\":" + s.programId + ",\"owner\":\"load" + (i % clientCount) + "\",\"targetName\":\"Plan target "
                        + i + "\",\"ra\":" + ra + ",\"dec\":" + (10 + i % 30) + ",\"exposures\":[{\"filter\":\"V\",\"seconds\":60,"
                        + "\"count\":5}],\"earliestNight\":\"2027-01-10\",\"latestNight\":\"2027-01-11\",\"priority\":2}";
                long id = id(call(http, base, "POST", "/api/requests", admin, body, 201));
                call(http, base, "POST", "/api/requests/" + id + "/submit?version=0", admin, null, 200);
                call(http, base, "POST", "/api/requests/" + id + "/accept?version=1", admin, null, 200);
            }
            long run = id(call(http, base, "POST", "/api/planner/runs", admin,
                    "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-11\",\"seconds\":3}", 202));
            String state = "";
            String runBody = "";
            for (Instant until = Instant.now().plusSeconds(120); Instant.now().isBefore(until) && !state.equals("finished"); ) {
                Thread.sleep(250);
                runBody = call(http, base, "GET", "/api/planner/runs/" + run, admin, null, 200);
                state = field(runBody, "state");
                if (state.equals("failed") || state.equals("cancelled")) {
                    throw new IllegalStateException("the setup planner run ended " + state + ": " + runBody);
                }
            }
            Matcher rev = Pattern.compile("\"revision\"\\s*:\\s*(\\d+)").matcher(runBody);
            if (!rev.find()) {
                throw new IllegalStateException("the setup run wrote no revision: " + runBody);
            }
            String published = call(http, base, "POST", "/api/plans/draft/publish?revision=" + rev.group(1), admin, null, 200);
            s.publishedVisits = published.split("\"telescopeId\"", -1).length - 1;
            for (int i = 0; i < clientCount; i++) {
                Client c = new Client("load" + i);
                c.signIn(http, base, password);
                s.clients.add(c);
            }
            return s;
        }
    }

    static final class Stats {
        final AtomicLong errors = new AtomicLong();
        final AtomicLong submissions = new AtomicLong();
        final AtomicLong queueReads = new AtomicLong();
        final AtomicLong planReads = new AtomicLong();
        final ConcurrentLinkedQueue<long[]> perClient = new ConcurrentLinkedQueue<>();
        /** The slowest call that ended in each second of the phase, nanoseconds: shows whether slow calls come in bursts. */
        final AtomicLongArray slowestPerSecond;
        final long startNanos = System.nanoTime();

        Stats(int seconds) {
            slowestPerSecond = new AtomicLongArray(seconds + 5);
        }

        void ended(long took) {
            int second = (int) Math.min(slowestPerSecond.length() - 1, (System.nanoTime() - startNanos) / 1_000_000_000L);
            slowestPerSecond.accumulateAndGet(second, took, Math::max);
        }

        long[] latencies() {
            int n = perClient.stream().mapToInt(a -> (int) a[0]).sum();
            long[] all = new long[n];
            int at = 0;
            for (long[] a : perClient) {
                System.arraycopy(a, 1, all, at, (int) a[0]);
                at += (int) a[0];
            }
            return all;
        }
    }

    /** Every client runs the mix for {@code seconds}; with {@code stats} null nothing is counted (warm-up). */
    private static void phase(ExecutorService pool, Setup setup, int clients, int seconds, double pace, Mix mix,
                              ConcurrentLinkedQueue<long[]> acknowledged, Stats stats) throws Exception {
        long intervalNanos = pace > 0 ? Math.round(1e9 / pace) : 0;
        long phaseStart = System.nanoTime();
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(seconds);
        CountDownLatch ready = new CountDownLatch(clients);
        List<Future<?>> futures = new ArrayList<>();
        for (int c = 0; c < clients; c++) {
            Client client = setup.clients.get(c);
            int clientIndex = c;
            long seed = c * 7919L + (stats == null ? 1 : 2);
            futures.add(pool.submit(() -> {
                SplittableRandom random = new SplittableRandom(seed);
                long[] lat = new long[1 << 16];
                int n = 0;
                ready.countDown();
                // Paced clients start at spread-out moments, so that they do not all call in the same instant.
                long scheduled = phaseStart + (intervalNanos == 0 ? 0 : random.nextLong(intervalNanos));
                while (System.nanoTime() < end) {
                    int pick = random.nextInt(100);
                    long t0;
                    if (intervalNanos > 0) {
                        long wait = scheduled - System.nanoTime();
                        if (wait > 0) {
                            try {
                                TimeUnit.NANOSECONDS.sleep(wait);
                            } catch (InterruptedException e) {
                                Thread.currentThread().interrupt();
                                return;
                            }
                        }
                        // Latency counts from the moment the call was due, not from when it went out: a server
                        // that falls behind cannot hide its queue by slowing the clients down.
                        t0 = scheduled;
                        scheduled += intervalNanos;
                    } else {
                        t0 = System.nanoTime();
                    }
                    boolean ok;
                    long ackedId = -1;
                    String name = null;
                    try {
                        HttpResponse<String> r;
                        if (pick < mix.submissions()) {
                            name = "NGC " + random.nextInt(1, 7841) + " " + client.username + "-" + random.nextInt(1 << 30);
                            String body = "{\"programId\":" + setup.programId + ",\"targetName\":\"" + name + "\",\"ra\":"
                                    + random.nextInt(0, 36000) / 100.0 + ",\"dec\":" + (random.nextInt(0, 17000) / 100.0 - 85)
                                    + ",\"exposures\":[{\"filter\":\"V\",\"seconds\":30,\"count\":" + random.nextInt(1, 10)
                                    + "}],\"priority\":" + random.nextInt(1, 6) + "}";
                            r = client.send(setup.http, client.request(setup.base, "/api/requests")
                                    .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body)).build());
                            ok = r.statusCode() == 201;
                            if (ok) {
                                Matcher m = ID.matcher(r.body());
                                ackedId = m.find() ? Long.parseLong(m.group(1)) : -1;
                                ok = ackedId > 0;
                            }
                            if (stats != null) {
                                stats.submissions.incrementAndGet();
                            }
                        } else if (pick < mix.submissions() + mix.queueReads()) {
                            r = client.send(setup.http, client.request(setup.base, "/api/requests?size=20&page=" + random.nextInt(3)).GET().build());
                            ok = r.statusCode() == 200;
                            if (stats != null) {
                                stats.queueReads.incrementAndGet();
                            }
                        } else {
                            r = client.send(setup.http, client.request(setup.base, "/api/plans/published").GET().build());
                            ok = r.statusCode() == 200;
                            if (stats != null) {
                                stats.planReads.incrementAndGet();
                            }
                        }
                        if (!ok && stats != null && stats.errors.get() < 5) {
                            System.err.println("load: " + r.statusCode() + " " + r.uri() + " " + r.body());
                        }
                    } catch (IOException e) {
                        ok = false;
                        if (stats != null && stats.errors.get() < 5) {
                            System.err.println("load: no answer: " + e);
                        }
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                        return;
                    }
                    long took = System.nanoTime() - t0;
                    CALLS.incrementAndGet();
                    if (ackedId > 0) {
                        acknowledged.add(new long[] {ackedId, clientIndex, name.hashCode()});
                    }
                    if (stats != null) {
                        if (!ok) {
                            stats.errors.incrementAndGet();
                        }
                        if (n == lat.length) {
                            lat = Arrays.copyOf(lat, lat.length * 2);
                        }
                        lat[n++] = took;
                        stats.ended(took);
                    }
                }
                if (stats != null) {
                    long[] out = new long[n + 1];
                    out[0] = n;
                    System.arraycopy(lat, 0, out, 1, n);
                    stats.perClient.add(out);
                }
            }));
        }
        for (Future<?> f : futures) {
            f.get();
        }
    }

    /** Reads every acknowledged submission back by id, with its owner's session; answers how many are missing or changed. */
    private static long verify(ExecutorService pool, Setup setup, ConcurrentLinkedQueue<long[]> acknowledged) throws Exception {
        List<long[]> all = new ArrayList<>(acknowledged);
        AtomicLong lost = new AtomicLong();
        int workers = Math.min(16, setup.clients.size());
        List<Future<?>> futures = new ArrayList<>();
        for (int w = 0; w < workers; w++) {
            int worker = w;
            futures.add(pool.submit(() -> {
                for (int i = worker; i < all.size(); i += workers) {
                    long[] a = all.get(i);
                    Client owner = setup.clients.get((int) a[1]);
                    boolean found;
                    try {
                        HttpResponse<String> r = owner.send(setup.http, owner.request(setup.base, "/api/requests/" + a[0]).GET().build());
                        found = r.statusCode() == 200 && field(r.body(), "targetName").hashCode() == (int) a[2];
                    } catch (IOException e) {
                        found = false;
                    } catch (InterruptedException e) {
                        Thread.currentThread().interrupt();
                        return;
                    }
                    if (!found) {
                        lost.incrementAndGet();
                        if (lost.get() <= 5) {
                            System.err.println("load: acknowledged request " + a[0] + " is missing or changed");
                        }
                    }
                }
            }));
        }
        for (Future<?> f : futures) {
            f.get();
        }
        return lost.get();
    }

    private static long percentile(long[] sorted, double p) {
        if (sorted.length == 0) {
            return 0;
        }
        int i = (int) Math.ceil(p * sorted.length) - 1;
        return sorted[Math.max(0, Math.min(sorted.length - 1, i))];
    }

    private static void awaitHealthy(HttpClient http, String base, Process server, Path log) throws Exception {
        for (Instant until = Instant.now().plus(Duration.ofMinutes(3)); Instant.now().isBefore(until); ) {
            if (!server.isAlive()) {
                throw new IllegalStateException("the server exited: " + Files.readString(log));
            }
            try {
                if (http.send(HttpRequest.newBuilder(URI.create(base + "/actuator/health")).build(),
                        HttpResponse.BodyHandlers.ofString()).statusCode() == 200) {
                    return;
                }
            } catch (IOException notYet) {
                // not listening yet
            }
            Thread.sleep(250);
        }
        throw new IllegalStateException("the server did not become healthy; log in " + log);
    }

    private static String call(HttpClient http, String base, String method, String path, String auth, String json, int expected)
            throws IOException, InterruptedException {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + path)).timeout(Duration.ofSeconds(60)).header("Authorization", auth);
        if (json != null) {
            b.header("Content-Type", "application/json");
        }
        b.method(method, json == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofString(json));
        HttpResponse<String> r = http.send(b.build(), HttpResponse.BodyHandlers.ofString());
        if (r.statusCode() != expected) {
            throw new IllegalStateException(method + " " + path + " answered " + r.statusCode() + ": " + r.body());
        }
        return r.body();
    }

    private static long id(String body) {
        Matcher m = ID.matcher(body);
        if (!m.find()) {
            throw new IllegalStateException("no id in " + body);
        }
        return Long.parseLong(m.group(1));
    }

    private static String field(String body, String name) {
        Matcher m = Pattern.compile("\"" + name + "\"\\s*:\\s*\"([^\"]*)\"").matcher(body);
        return m.find() ? m.group(1) : "";
    }

    private static String basic(String user, String password) {
        return "Basic " + Base64.getEncoder().encodeToString((user + ":" + password).getBytes(StandardCharsets.UTF_8));
    }

    private static String randomPassword() {
        byte[] b = new byte[15];
        new SecureRandom().nextBytes(b);
        return Base64.getUrlEncoder().withoutPadding().encodeToString(b);
    }

    /** {@code --clients 100 --seconds 60} or {@code clients=100 seconds=60}. */
    private static Map<String, String> options(String[] args) {
        Map<String, String> out = new HashMap<>();
        for (int i = 0; i < args.length; i++) {
            String a = args[i];
            if (a.startsWith("--") && a.contains("=")) {
                out.put(a.substring(2, a.indexOf('=')), a.substring(a.indexOf('=') + 1));
            } else if (a.startsWith("--") && i + 1 < args.length) {
                out.put(a.substring(2), args[++i]);
            } else if (a.contains("=")) {
                out.put(a.substring(0, a.indexOf('=')), a.substring(a.indexOf('=') + 1));
            } else {
                throw new IllegalArgumentException("unknown argument " + a + "; use --clients N --seconds S");
            }
        }
        return out;
    }
}
