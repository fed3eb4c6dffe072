package org.skyrota.web.request;

import com.fasterxml.jackson.annotation.JsonProperty;

/** How dark a request needs the sky: the Sun's centre below −18°, −12° or −6°. */
public enum DarknessLimit {
    @JsonProperty("astronomical") ASTRONOMICAL,
    @JsonProperty("nautical") NAUTICAL,
    @JsonProperty("civil") CIVIL
}
