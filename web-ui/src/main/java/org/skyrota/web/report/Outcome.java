package org.skyrota.web.report;

/** What a telescope reports about a visit: carried out, partly carried out, or failed (it goes back into the queue). */
public enum Outcome { DONE, PARTIAL, FAILED }
