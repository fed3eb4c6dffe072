package org.skyrota.web.request;

import java.util.EnumSet;
import java.util.Set;

import com.fasterxml.jackson.annotation.JsonProperty;

/**
 * Where an observing request stands. A requester drafts and submits; a coordinator accepts or
 * rejects (with a reason); the requester may withdraw at any point before the request is done.
 */
public enum RequestState {
    @JsonProperty("draft") DRAFT,
    @JsonProperty("submitted") SUBMITTED,
    @JsonProperty("accepted") ACCEPTED,
    @JsonProperty("rejected") REJECTED,
    @JsonProperty("withdrawn") WITHDRAWN;

    /** The states this one may change to. */
    Set<RequestState> next() {
        return switch (this) {
            case DRAFT -> EnumSet.of(SUBMITTED, WITHDRAWN);
            case SUBMITTED -> EnumSet.of(ACCEPTED, REJECTED, WITHDRAWN);
            case ACCEPTED -> EnumSet.of(WITHDRAWN);
            case REJECTED -> EnumSet.of(DRAFT);
            case WITHDRAWN -> EnumSet.noneOf(RequestState.class);
        };
    }

    boolean canBecome(RequestState target) {
        return next().contains(target);
    }
}
