package org.skyrota.web.account;

import java.time.Duration;

import jakarta.servlet.http.HttpSessionEvent;
import jakarta.servlet.http.HttpSessionListener;

import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * A browser session ends after {@code skyrota.session.idle-timeout} without a request (default 30 minutes); the
 * next call is 401 and the dashboard asks to sign in again. Set here rather than with the container's own setting,
 * which counts in whole minutes.
 */
@Component
class SessionIdleTimeout implements HttpSessionListener {

    private final int seconds;

    SessionIdleTimeout(@Value("${skyrota.session.idle-timeout:30m}") Duration idle) {
        this.seconds = (int) Math.max(1, idle.toSeconds());
    }

    @Override
    public void sessionCreated(HttpSessionEvent event) {
        event.getSession().setMaxInactiveInterval(seconds);
    }
}
