package org.skyrota.web.request;

import java.util.EnumSet;
import java.util.Set;

import com.fasterxml.jackson.annotation.JsonProperty;

/**
 * Where an observing request stands. A requester drafts and submits; a coordinator accepts or
 * rejects (with a reason); the requester may withdraw at any point before the request is done.
 * The server itself ends an accepted request: completed when every repeat is observed, expired when its
 * nights have passed without that (its owner may reopen it as a draft, with new nights).
 */
public enum RequestState {
    @JsonProperty("draft") DRAFT,
    @JsonProperty("submitted") SUBMITTED,
    @JsonProperty("accepted") ACCEPTED,
    @JsonProperty("rejected") REJECTED,
    @JsonProperty("withdrawn") WITHDRAWN,
    @JsonProperty("completed") COMPLETED,
    @JsonProperty("expired") EXPIRED;

    /** The states this one may change to. */
    Set<RequestState> next() {
        return switch (this) {
            case DRAFT -> EnumSet.of(SUBMITTED, WITHDRAWN);
            case SUBMITTED -> EnumSet.of(ACCEPTED, REJECTED, WITHDRAWN);
            case ACCEPTED -> EnumSet.of(WITHDRAWN, COMPLETED, EXPIRED);
            case REJECTED, EXPIRED -> EnumSet.of(DRAFT);
            case WITHDRAWN, COMPLETED -> EnumSet.noneOf(RequestState.class);
        };
    }

    boolean canBecome(RequestState target) {
        return next().contains(target);
    }
}
