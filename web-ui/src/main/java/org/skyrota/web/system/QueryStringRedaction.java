package org.skyrota.web.system;

import java.io.IOException;
import java.util.regex.Pattern;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;

import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * A feed reader can only send its feed token in the URL ({@code ?token=}), and at DEBUG both Spring Security and
 * Spring MVC log the query string of every request. From here on the query string reads {@code token=(hidden)};
 * the parameter itself ({@code getParameter("token")}) is untouched, so the token filter still reads it. Runs before
 * the security chain. Tomcat's access log sits outside the filters; its pattern (application.properties) leaves the
 * query string out.
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE + 2)
class QueryStringRedaction extends OncePerRequestFilter {

    private static final Pattern SECRET = Pattern.compile("(^|&)(token|access_token)=[^&]*", Pattern.CASE_INSENSITIVE);

    static String redact(String query) {
        return query == null ? null : SECRET.matcher(query).replaceAll("$1$2=(hidden)");
    }

    @Override
    protected boolean shouldNotFilter(HttpServletRequest request) {
        String q = request.getQueryString();
        return q == null || !SECRET.matcher(q).find();
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        String redacted = redact(request.getQueryString());
        chain.doFilter(new HttpServletRequestWrapper(request) {
            @Override
            public String getQueryString() {
                return redacted;
            }
        }, response);
    }
}
