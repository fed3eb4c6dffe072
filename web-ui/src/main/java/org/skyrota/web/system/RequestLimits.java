package org.skyrota.web.system;

import java.io.IOException;
import java.util.List;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;

import org.springframework.beans.factory.annotation.Value;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;
import org.springframework.web.servlet.HandlerInterceptor;

/**
 * Limits that keep one client from tying up the server: a request body of at most {@code skyrota.max-body-bytes}
 * (default 1 MiB; larger is 413 before anything is read, or as soon as a body without a length passes the limit),
 * and list pages of at most 500 items ({@code size} 1..500, {@code page} from 0; other values are 400 naming the
 * parameter rather than being quietly changed).
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE)
public class RequestLimits extends OncePerRequestFilter {

    public static final int MAX_PAGE_SIZE = 500;

    private final long maxBodyBytes;

    RequestLimits(@Value("${skyrota.max-body-bytes:1048576}") long maxBodyBytes) {
        this.maxBodyBytes = maxBodyBytes;
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        long length = request.getContentLengthLong();
        if (length > maxBodyBytes) {
            tooLarge(request, response);
            return;
        }
        try {
            chain.doFilter(length >= 0 ? request : new Limited(request, maxBodyBytes), response);
        } catch (BodyTooLargeException e) {
            if (!response.isCommitted()) {
                response.reset();
                tooLarge(request, response);
            }
        }
    }

    private void tooLarge(HttpServletRequest request, HttpServletResponse response) throws IOException {
        response.setStatus(413);
        response.setContentType("application/problem+json");
        response.setCharacterEncoding("UTF-8");
        response.setHeader("Connection", "close");
        response.getWriter().write("{\"type\":\"urn:skyrota:problem:too-large\",\"title\":\"Request body too large\",\"status\":413,"
                + "\"detail\":\"A request body may be at most " + maxBodyBytes + " bytes.\",\"instance\":\""
                + request.getRequestURI().replace("\\", "\\\\").replace("\"", "\\\"") + "\"}");
    }

    /** Thrown while reading a body without a declared length once it passes the limit. */
    static final class BodyTooLargeException extends IOException {
        BodyTooLargeException() {
            super("request body too large");
        }
    }

    /** A request whose body stream fails once more than the limit has been read. */
    private static final class Limited extends HttpServletRequestWrapper {
        private final long limit;
        private ServletInputStream stream;

        Limited(HttpServletRequest request, long limit) {
            super(request);
            this.limit = limit;
        }

        @Override
        public ServletInputStream getInputStream() throws IOException {
            if (stream == null) {
                ServletInputStream in = super.getInputStream();
                stream = new ServletInputStream() {
                    long read;

                    @Override
                    public int read() throws IOException {
                        int b = in.read();
                        if (b >= 0 && ++read > limit) {
                            throw new BodyTooLargeException();
                        }
                        return b;
                    }

                    @Override
                    public int read(byte[] buf, int off, int len) throws IOException {
                        int n = in.read(buf, off, len);
                        if (n > 0 && (read += n) > limit) {
                            throw new BodyTooLargeException();
                        }
                        return n;
                    }

                    @Override
                    public boolean isFinished() {
                        return in.isFinished();
                    }

                    @Override
                    public boolean isReady() {
                        return in.isReady();
                    }

                    @Override
                    public void setReadListener(ReadListener listener) {
                        in.setReadListener(listener);
                    }
                };
            }
            return stream;
        }
    }

    /** Refuses page parameters out of range before a listing runs (registered in {@link WebConfig}). */
    static final class PageParameters implements HandlerInterceptor {
        @Override
        public boolean preHandle(HttpServletRequest request, HttpServletResponse response, Object handler) {
            QueryParameters q = new QueryParameters();
            String size = request.getParameter("size");
            String page = request.getParameter("page");
            if (size != null && !size.isBlank()) {
                q.optionalNumber("size", size, 1, MAX_PAGE_SIZE);
                if (q.isValid() && !size.trim().matches("\\d+")) {
                    q.reject("size", "must be a whole number from 1 to " + MAX_PAGE_SIZE + ", was '" + size + "'");
                }
            }
            if (page != null && !page.isBlank() && !page.trim().matches("\\d{1,9}")) {
                q.reject("page", "must be a whole number from 0, was '" + page + "'");
            }
            q.throwIfInvalid();
            return true;
        }
    }

    static List<String> pagedPrefixes() {
        return List.of("/api/**");
    }
}
