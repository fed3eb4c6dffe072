package org.skyrota.web.report;

import java.io.IOException;
import java.util.List;
import java.util.Optional;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;

import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.springframework.http.MediaType;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Signs in machines and feed readers: {@code Authorization: Bearer <token>} with an API token (only where its scope
 * allows: {@code reports} for {@code POST /api/reports}, {@code read} for the published plan and its exports), and
 * {@code ?token=} with a person's feed token on {@code /api/calendar/mine.ics}. An unknown or revoked token is 401,
 * a token used outside its scope 403, both as problem documents. Not a bean: the security chain owns it.
 */
public class TokenAuthenticationFilter extends OncePerRequestFilter {

    private static final List<String> READ_PATHS = List.of("/api/plans/published", "/api/plans/published.csv",
            "/api/plans/published.ics");
    static final String FEED_PATH = "/api/calendar/mine.ics";

    private final ApiTokenRepository tokens;
    private final FeedTokenRepository feeds;
    private final AccountRepository accounts;

    public TokenAuthenticationFilter(ApiTokenRepository tokens, FeedTokenRepository feeds, AccountRepository accounts) {
        this.tokens = tokens;
        this.feeds = feeds;
        this.accounts = accounts;
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        String header = request.getHeader("Authorization");
        if (header != null && header.regionMatches(true, 0, "Bearer ", 0, 7)) {
            Optional<ApiToken> found = tokens.findByTokenHash(TokenText.hash(header.substring(7).trim()));
            if (found.isEmpty() || found.get().isRevoked()) {
                response.setHeader("WWW-Authenticate", "Bearer realm=\"Skyrota\"");
                problem(request, response, 401, "Unauthorized", found.isEmpty() ? "The token is not known."
                        : "The token was revoked.");
                return;
            }
            ApiToken t = found.get();
            if (!allowed(t.getScope(), request)) {
                problem(request, response, 403, "Forbidden", "A token of scope " + t.getScope() + " does not allow this.");
                return;
            }
            TokenPrincipal principal = new TokenPrincipal(t.getId(), t.getName(), t.getTelescopeId(), t.getScope());
            SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                    principal, null, List.of(new SimpleGrantedAuthority("SCOPE_" + t.getScope()))));
        } else if (header == null && FEED_PATH.equals(request.getRequestURI()) && request.getParameter("token") != null) {
            Optional<Account> account = feeds.findByTokenHash(TokenText.hash(request.getParameter("token")))
                    .flatMap(f -> accounts.findByUsername(f.getUsername())).filter(Account::isEnabled);
            if (account.isEmpty()) {
                problem(request, response, 401, "Unauthorized", "The feed token is not known.");
                return;
            }
            Account a = account.get();
            SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                    a.getUsername(), null, List.of(new SimpleGrantedAuthority(a.getRole().authority()))));
        }
        chain.doFilter(request, response);
    }

    private static boolean allowed(String scope, HttpServletRequest request) {
        String path = request.getRequestURI();
        return switch (scope) {
            case "reports" -> "POST".equals(request.getMethod()) && "/api/reports".equals(path);
            case "read" -> "GET".equals(request.getMethod()) && READ_PATHS.contains(path);
            default -> false;
        };
    }

    private static void problem(HttpServletRequest request, HttpServletResponse response, int status, String title,
                                String detail) throws IOException {
        response.setStatus(status);
        response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
        response.setCharacterEncoding("UTF-8");
        response.getWriter().write("{\"type\":\"about:blank\",\"title\":\"" + title + "\",\"status\":" + status
                + ",\"detail\":\"" + detail + "\",\"instance\":\"" + request.getRequestURI().replace("\"", "") + "\"}");
    }
}
