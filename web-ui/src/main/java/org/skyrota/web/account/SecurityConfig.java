package org.skyrota.web.account;

import java.io.IOException;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;

import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.http.HttpMethod;
import org.springframework.http.MediaType;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.skyrota.web.report.ApiTokenRepository;
import org.skyrota.web.report.FeedTokenRepository;
import org.skyrota.web.report.TokenAuthenticationFilter;
import org.springframework.security.web.SecurityFilterChain;
import org.springframework.security.web.authentication.www.BasicAuthenticationFilter;
import org.springframework.security.web.servlet.util.matcher.PathPatternRequestMatcher;
import org.springframework.security.web.util.matcher.AndRequestMatcher;
import org.springframework.security.web.csrf.CookieCsrfTokenRepository;
import org.springframework.security.web.csrf.CsrfTokenRequestAttributeHandler;

/**
 * Who may do what. Scripts send HTTP Basic on every call (no session, no CSRF token needed:
 * a forged cross-site request cannot carry the header); browsers sign in with a form, keep a
 * session, and send the CSRF token from the {@code XSRF-TOKEN} cookie in {@code X-XSRF-TOKEN}.
 * The compute endpoints (but visibility at a stored site), health and the API description are open; everything else under /api
 * needs an account, and changes to sites, equipment, programs and accounts need a coordinator
 * or an admin. Which requests a requester sees is decided in the request service.
 */
@Configuration
class SecurityConfig {

    private static final String[] REFERENCE_DATA = {"/api/sites/**", "/api/telescopes/**", "/api/instruments/**", "/api/programs/**"};
    private static final String REVIEWER_ROLES_COORDINATOR = "COORDINATOR";
    private static final String REVIEWER_ROLES_ADMIN = "ADMIN";

    @Bean
    PasswordEncoder passwordEncoder() {
        return new BCryptPasswordEncoder();
    }

    /** Registered in the security chain only, not a second time as a plain servlet filter. */
    @Bean
    org.springframework.boot.web.servlet.FilterRegistrationBean<SignInThrottle> signInThrottleOutsideTheChain(SignInThrottle throttle) {
        org.springframework.boot.web.servlet.FilterRegistrationBean<SignInThrottle> r = new org.springframework.boot.web.servlet.FilterRegistrationBean<>(throttle);
        r.setEnabled(false);
        return r;
    }

    @Bean
    SecurityFilterChain api(HttpSecurity http, ApiTokenRepository apiTokens, FeedTokenRepository feedTokens,
                            AccountRepository accounts, SignInThrottle throttle) throws Exception {
        CsrfTokenRequestAttributeHandler plainToken = new CsrfTokenRequestAttributeHandler();
        http
                .authorizeHttpRequests(auth -> auth
                        // Visibility at a stored site reads the site and its telescopes: only for those signed in.
                        .requestMatchers(new AndRequestMatcher(
                                PathPatternRequestMatcher.pathPattern(HttpMethod.GET, "/api/visibility"),
                                request -> request.getParameter("siteId") != null)).authenticated()
                        .requestMatchers(HttpMethod.GET, "/api/almanac", "/api/visibility", "/api/about").permitAll()
                        .requestMatchers("/actuator/health", "/actuator/health/**", "/actuator/info").permitAll()
                        .requestMatchers("/v3/api-docs", "/v3/api-docs/**", "/swagger-ui/**", "/swagger-ui.html").permitAll()
                        .requestMatchers("/api/accounts/me", "/api/accounts/me/password", "/api/accounts/me/feed-token").authenticated()
                        .requestMatchers(HttpMethod.POST, "/api/reports").hasAuthority("SCOPE_reports")
                        .requestMatchers("/api/tokens", "/api/tokens/**").hasRole(REVIEWER_ROLES_ADMIN)
                        .requestMatchers("/api/accounts", "/api/accounts/**").hasRole(REVIEWER_ROLES_ADMIN)
                        .requestMatchers(HttpMethod.PUT, "/api/clock").hasRole(REVIEWER_ROLES_ADMIN)
                        .requestMatchers("/api/audit", "/api/audit/**").hasAnyRole(REVIEWER_ROLES_COORDINATOR, REVIEWER_ROLES_ADMIN)
                        .requestMatchers("/api/planner/**", "/api/visits/**", "/api/alerts").hasAnyRole(REVIEWER_ROLES_COORDINATOR, REVIEWER_ROLES_ADMIN)
                        .requestMatchers(HttpMethod.GET, "/api/plans/**").authenticated()
                        .requestMatchers("/api/plans/**").hasAnyRole(REVIEWER_ROLES_COORDINATOR, REVIEWER_ROLES_ADMIN)
                        .requestMatchers(HttpMethod.GET, REFERENCE_DATA).authenticated()
                        .requestMatchers(REFERENCE_DATA).hasAnyRole(REVIEWER_ROLES_COORDINATOR, REVIEWER_ROLES_ADMIN)
                        .requestMatchers(HttpMethod.POST, "/api/requests/*/accept", "/api/requests/*/reject")
                        .hasAnyRole(REVIEWER_ROLES_COORDINATOR, REVIEWER_ROLES_ADMIN)
                        .requestMatchers("/api/**", "/actuator/**").authenticated()
                        .anyRequest().permitAll())
                .httpBasic(basic -> basic.realmName("Skyrota").authenticationEntryPoint(SecurityConfig::unauthorized))
                .formLogin(form -> form.permitAll())
                .logout(logout -> logout.permitAll())
                // An API call refused for want of a login must not open a session to remember it.
                .requestCache(cache -> cache.disable())
                .csrf(csrf -> csrf
                        .csrfTokenRepository(CookieCsrfTokenRepository.withHttpOnlyFalse())
                        .csrfTokenRequestHandler(plainToken)
                        .ignoringRequestMatchers(SecurityConfig::carriesCredentials))
                .addFilterBefore(new TokenAuthenticationFilter(apiTokens, feedTokens, accounts), BasicAuthenticationFilter.class)
                .addFilterAfter(new CsrfCookieFilter(), BasicAuthenticationFilter.class)
                .addFilterBefore(throttle, org.springframework.security.web.authentication.UsernamePasswordAuthenticationFilter.class)
                .exceptionHandling(e -> e
                        .defaultAuthenticationEntryPointFor(SecurityConfig::unauthorized, request -> request.getRequestURI().startsWith("/api/"))
                        .accessDeniedHandler((request, response, denied) -> problem(request, response, 403, "Forbidden",
                                carriesCredentials(request) || request.getUserPrincipal() != null
                                        ? "Your role does not allow this."
                                        : "A browser session must send the CSRF token (X-XSRF-TOKEN) with every change.")));
        return http.build();
    }

    /** Requests that authenticate themselves (HTTP Basic); CSRF protects only cookie sessions. */
    private static boolean carriesCredentials(HttpServletRequest request) {
        String header = request.getHeader("Authorization");
        return header != null && !header.isBlank();
    }

    private static void unauthorized(HttpServletRequest request, HttpServletResponse response,
                                     org.springframework.security.core.AuthenticationException e) throws IOException {
        if (e instanceof org.springframework.security.authentication.AuthenticationServiceException) {
            // The credentials could not be checked at all (the database failed): not the caller's fault.
            response.setHeader("Retry-After", "1");
            problem(request, response, 503, "Service Unavailable",
                    "Sign-in could not be checked because the database is unavailable; try again shortly.");
            return;
        }
        // A script's call from the dashboard (marked X-Requested-With) gets no Basic challenge, on which a browser
        // would open its own password dialog over the page; everyone else is told how to sign in.
        if (!"XMLHttpRequest".equals(request.getHeader("X-Requested-With"))) {
            response.setHeader("WWW-Authenticate", "Basic realm=\"Skyrota\"");
        }
        problem(request, response, 401, "Unauthorized", "Sign in (HTTP Basic, or a browser session) to use this.");
    }

    private static void problem(HttpServletRequest request, HttpServletResponse response, int status, String title, String detail)
            throws IOException {
        response.setStatus(status);
        response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
        response.setCharacterEncoding("UTF-8");
        response.getWriter().write("{\"type\":\"about:blank\",\"title\":\"" + title + "\",\"status\":" + status
                + ",\"detail\":\"" + detail + "\",\"instance\":\"" + json(request.getRequestURI()) + "\"}");
    }

    private static String json(String text) {
        StringBuilder out = new StringBuilder();
        for (char c : text.toCharArray()) {
            if (c == '"' || c == '\\') {
                out.append('\\').append(c);
            } else if (c < 0x20) {
                out.append(String.format("\\u%04x", (int) c));
            } else {
                out.append(c);
            }
        }
        return out.toString();
    }
}
