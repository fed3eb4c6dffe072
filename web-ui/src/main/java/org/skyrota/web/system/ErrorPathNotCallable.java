package org.skyrota.web.system;

import java.io.IOException;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;

import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * {@code /error} is where the servlet container forwards its own failures (a malformed URL, a failure outside
 * Spring MVC); called directly it has no failure to describe, and Spring Boot's error controller then answered 500
 * with a body that is not a problem document. A direct call is now 404 like any other unknown path. The filter runs
 * for client requests only, never for the container's error forwards, which keep reaching the error controller.
 */
@Component
@Order(Ordered.HIGHEST_PRECEDENCE + 1)
class ErrorPathNotCallable extends OncePerRequestFilter {

    static final String ERROR_PATH = "/error";

    @Override
    protected boolean shouldNotFilter(HttpServletRequest request) {
        String path = request.getRequestURI().substring(request.getContextPath().length());
        return !path.equals(ERROR_PATH);
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        response.setStatus(404);
        response.setContentType("application/problem+json");
        response.setCharacterEncoding("UTF-8");
        response.getWriter().write("{\"type\":\"" + ProblemTypes.NOT_FOUND + "\",\"title\":\"Not found\",\"status\":404,"
                + "\"detail\":\"No endpoint " + ERROR_PATH + "\",\"instance\":\"" + ERROR_PATH + "\"}");
    }
}
