package org.skyrota.web.support;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;

import com.jayway.jsonpath.JsonPath;

/**
 * A plain HTTP client for tests against the server on its real port: Basic or Bearer credentials, JSON bodies,
 * and a reader for server-sent events.
 */
public final class ApiClient {

    private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
    private final String base;

    public ApiClient(int port) {
        this.base = "http://127.0.0.1:" + port;
    }

    /** A response: status, content type and body. */
    public record Answer(int status, String contentType, String body) {
        public <T> T json(String path) {
            return JsonPath.read(body, path);
        }

        public long id(String path) {
            return ((Number) JsonPath.read(body, path)).longValue();
        }
    }

    /** One server-sent event. */
    public record Event(String name, String data) {}

    public static String basic(String user, String password) {
        return "Basic " + Base64.getEncoder().encodeToString((user + ":" + password).getBytes(StandardCharsets.UTF_8));
    }

    public static String bearer(String token) {
        return "Bearer " + token;
    }

    public Answer get(String path, String auth) {
        return send("GET", path, auth, null);
    }

    public Answer post(String path, String auth, String json) {
        return send("POST", path, auth, json);
    }

    public Answer put(String path, String auth, String json) {
        return send("PUT", path, auth, json);
    }

    public Answer delete(String path, String auth) {
        return send("DELETE", path, auth, null);
    }

    public Answer send(String method, String path, String auth, String json) {
        return send(method, path, auth, json, "application/json");
    }

    /** Sends {@code body} (when not null) as {@code contentType}. */
    public Answer send(String method, String path, String auth, String body, String contentType) {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + path)).timeout(Duration.ofSeconds(120));
        if (auth != null) {
            b.header("Authorization", auth);
        }
        if (body != null) {
            b.header("Content-Type", contentType);
        }
        b.method(method, body == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofString(body));
        try {
            HttpResponse<String> r = http.send(b.build(), HttpResponse.BodyHandlers.ofString());
            return new Answer(r.statusCode(), r.headers().firstValue("Content-Type").orElse(""), r.body());
        } catch (IOException e) {
            throw new IllegalStateException(method + " " + path + " failed", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    /**
     * Waits, by reading the run's stored state, until planner run {@code runId} has ended; returns its final view.
     * For tests that need a finished run, not its event stream (which PlannerRunApiTest checks).
     */
    public Answer awaitRunEnd(long runId, String auth, Duration timeout) {
        long until = System.nanoTime() + timeout.toNanos();
        while (true) {
            Answer run = get("/api/planner/runs/" + runId, auth);
            String state = run.status() == 200 ? run.json("$.state") : null;
            if (state != null && !state.equals("queued") && !state.equals("running")) {
                return run;
            }
            if (System.nanoTime() > until) {
                throw new IllegalStateException("planner run " + runId + " had not ended after " + timeout + ": " + run.body());
            }
            try {
                Thread.sleep(100);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new IllegalStateException(e);
            }
        }
    }

    /**
     * Reads a {@code text/event-stream} until the event named {@code last} (inclusive); a stream that ends before it
     * is an error that says what it sent.
     */
    public List<Event> events(String path, String auth, String last, Duration timeout) {
        HttpRequest request = HttpRequest.newBuilder(URI.create(base + path)).timeout(timeout)
                .header("Authorization", auth).header("Accept", "text/event-stream").GET().build();
        List<Event> events = new ArrayList<>();
        long startNanos = System.nanoTime();
        try {
            HttpResponse<java.io.InputStream> r = http.send(request, HttpResponse.BodyHandlers.ofInputStream());
            if (r.statusCode() != 200) {
                throw new IllegalStateException("event stream answered " + r.statusCode());
            }
            try (BufferedReader in = new BufferedReader(new InputStreamReader(r.body(), StandardCharsets.UTF_8))) {
                String name = "message";
                StringBuilder data = new StringBuilder();
                String line;
                while ((line = in.readLine()) != null) {
                    if (line.isEmpty()) {
                        if (!data.isEmpty()) {
                            events.add(new Event(name, data.toString()));
                            if (name.equals(last)) {
                                return events;
                            }
                        }
                        name = "message";
                        data.setLength(0);
                    } else if (line.startsWith("event:")) {
                        name = line.substring(6).trim();
                    } else if (line.startsWith("data:")) {
                        if (!data.isEmpty()) {
                            data.append('\n');
                        }
                        data.append(line.substring(5).trim());
                    }
                }
            }
            if (last == null) {
                return events;
            }
            throw new IllegalStateException("event stream " + path + " ended after "
                    + Duration.ofNanos(System.nanoTime() - startNanos).toSeconds() + " s without a '" + last
                    + "' event; it sent " + events);
        } catch (IOException e) {
            throw new IllegalStateException("event stream " + path + " failed after "
                    + Duration.ofNanos(System.nanoTime() - startNanos).toSeconds() + " s; it sent " + events, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }
}
