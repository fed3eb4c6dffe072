package org.skyrota.web.system;

import java.time.Instant;

/** The server's clock was moved forward, from {@code from} to {@code to}. */
public record ClockMoved(Instant from, Instant to) {}
