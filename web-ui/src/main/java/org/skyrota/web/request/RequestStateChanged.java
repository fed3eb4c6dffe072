package org.skyrota.web.request;

/**
 * A request moved from one state to another, published in the transaction that moved it, so that the plan can follow
 * (a withdrawn request's visits ahead leave the draft at once).
 */
public record RequestStateChanged(long requestId, RequestState from, RequestState to) {}
