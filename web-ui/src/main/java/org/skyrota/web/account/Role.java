package org.skyrota.web.account;

import com.fasterxml.jackson.annotation.JsonProperty;

/**
 * What a person may do. A requester queues and manages their own observing requests; a
 * coordinator reviews everyone's requests and keeps sites, equipment and programs; an admin
 * also manages accounts.
 */
public enum Role {
    @JsonProperty("requester") REQUESTER,
    @JsonProperty("coordinator") COORDINATOR,
    @JsonProperty("admin") ADMIN;

    /** The Spring Security authority of this role. */
    public String authority() {
        return "ROLE_" + name();
    }
}
