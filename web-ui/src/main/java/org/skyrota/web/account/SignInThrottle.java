package org.skyrota.web.account;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.util.Base64;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.event.EventListener;
import org.springframework.security.authentication.event.AbstractAuthenticationFailureEvent;
import org.springframework.security.authentication.event.AuthenticationSuccessEvent;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Slows guessing: after {@code skyrota.sign-in.free-failures} (default 5) failed sign-ins for one user name, each further attempt must wait, 1 s after the first extra failure and doubling up to 5 minutes;
 * an attempt made too soon is answered 429 with {@code Retry-After} before any password is checked. A successful
 * sign-in clears the user name's count. Counts live in memory: a restart forgives. The refusal does not say whether
 * the account exists, and nothing of the password is logged.
 */
@Component
public class SignInThrottle extends OncePerRequestFilter {

    private static final Logger log = LoggerFactory.getLogger(SignInThrottle.class);
    private static final long MAX_DELAY_MILLIS = 300_000;
    private static final int MAX_TRACKED = 100_000;

    private record Failures(int count, long lastAtMillis) {}

    private final Map<String, Failures> failures = new ConcurrentHashMap<>();
    private final int freeFailures;
    private final Clock clock;

    @org.springframework.beans.factory.annotation.Autowired
    SignInThrottle(@Value("${skyrota.sign-in.free-failures:5}") int freeFailures) {
        this(freeFailures, Clock.systemUTC());
    }

    SignInThrottle(int freeFailures, Clock clock) {
        this.freeFailures = freeFailures;
        this.clock = clock;
    }

    /** How long attempts for this user name must still wait, in milliseconds (0: none). */
    long waitMillis(String username) {
        return waitForKey(userKey(username));
    }

    private long waitForKey(String key) {
        Failures f = key == null ? null : failures.get(key);
        if (f == null || f.count() < freeFailures) {
            return 0;
        }
        long delay = Math.min(MAX_DELAY_MILLIS, 1000L << Math.min(20, f.count() - freeFailures));
        return Math.max(0, f.lastAtMillis() + delay - clock.millis());
    }

    @EventListener
    void failed(AbstractAuthenticationFailureEvent event) {
        if (failures.size() > MAX_TRACKED) {
            failures.clear(); // a flood of made-up names must not exhaust memory
        }
        long now = clock.millis();
        String user = userKey(event.getAuthentication().getName());
        if (user != null) {
            failures.merge(user, new Failures(1, now), (a, b) -> new Failures(a.count() + 1, now));
        }
        Failures f = user == null ? null : failures.get(user);
        if (f != null && f.count() == freeFailures) {
            log.warn("{} failed sign-ins for one user name; further attempts are slowed", f.count());
        }
    }

    @EventListener
    void succeeded(AuthenticationSuccessEvent event) {
        String user = userKey(event.getAuthentication().getName());
        if (user != null) {
            failures.remove(user);
        }
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        String username = attemptedUsername(request);
        if (username == null) {
            chain.doFilter(request, response);
            return;
        }
        long wait = waitMillis(username);
        if (wait > 0) {
            long seconds = (wait + 999) / 1000;
            response.setStatus(429);
            response.setHeader("Retry-After", Long.toString(seconds));
            response.setContentType("application/problem+json");
            response.setCharacterEncoding("UTF-8");
            response.getWriter().write("{\"type\":\"urn:skyrota:problem:too-many-sign-in-failures\",\"title\":\"Too many failed sign-ins\","
                    + "\"status\":429,\"detail\":\"Too many failed sign-ins; try again in " + seconds + " s.\",\"instance\":\""
                    + request.getRequestURI().replace("\\", "\\\\").replace("\"", "\\\"") + "\"}");
            return;
        }
        chain.doFilter(request, response);
    }

    /** The user name a request tries to sign in with (HTTP Basic, or the sign-in form), or null when it tries none. */
    private static String attemptedUsername(HttpServletRequest request) {
        String header = request.getHeader("Authorization");
        if (header != null && header.regionMatches(true, 0, "Basic ", 0, 6)) {
            try {
                String decoded = new String(Base64.getDecoder().decode(header.substring(6).trim()), StandardCharsets.UTF_8);
                int colon = decoded.indexOf(':');
                return colon < 0 ? decoded : decoded.substring(0, colon);
            } catch (IllegalArgumentException notBase64) {
                return "";
            }
        }
        if ("POST".equals(request.getMethod()) && "/login".equals(request.getServletPath())) {
            String name = request.getParameter("username");
            return name == null ? "" : name;
        }
        return null;
    }

    private static String userKey(String username) {
        return username == null ? null : "user:" + username.trim().toLowerCase(Locale.ROOT);
    }
}
