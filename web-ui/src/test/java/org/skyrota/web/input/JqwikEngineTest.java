package org.skyrota.web.input;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

/**
 * jqwik 1.10.1 is built against JUnit Platform 1.14 while Spring Boot 4.0.7 manages Platform 6.0.x: this property
 * fails (or is never found) if the jqwik engine cannot run under the managed platform.
 */
class JqwikEngineTest {

    @Property(tries = 50, seed = "42")
    void reversingAListTwiceGivesItBack(@ForAll List<Integer> values) {
        List<Integer> twice = new ArrayList<>(values);
        Collections.reverse(twice);
        Collections.reverse(twice);
        assertThat(twice).isEqualTo(values);
    }
}
