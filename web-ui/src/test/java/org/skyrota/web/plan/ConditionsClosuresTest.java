package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.mockito.Mockito.mock;
import static org.mockito.Mockito.when;

import java.time.LocalDate;
import java.util.List;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.skyrota.plugin.ConditionsFeed;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.SiteCondition;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.site.Site;
import org.springframework.test.util.ReflectionTestUtils;

/**
 * Which forecast closes a night: one that says closed, or a cloud fraction at or above the limit
 * ({@code skyrota.conditions.close-at-cloud-fraction}); anything else leaves it open. Invented site and forecasts.
 */
class ConditionsClosuresTest {

    private static final LocalDate NIGHT = LocalDate.of(2027, 3, 2);

    @ParameterizedTest(name = "limit {0}, cloud {1}, closed {2}: night closed {3}")
    @CsvSource(nullValues = "none", value = {
            "0.9, 0.95, false, true",
            "0.9, 0.5,  false, false",
            "0.9, 0.9,  false, true",
            "0.9, 0.89, false, false",
            "0.9, none, false, false",
            "0.9, none, true,  true",
            "0.9, 0.1,  true,  true",
            "0.4, 0.5,  false, true",
            "1.0, 0.95, false, false",
    })
    void aNightClosesWhenSaidClosedOrAtLeastAsCloudyAsTheLimit(double limit, Double cloud, boolean closed,
                                                                boolean expectClosed) {
        Site site = new Site("Ridge Site", 45, 7, 500);
        Telescope telescope = new Telescope(site, "T40");
        ReflectionTestUtils.setField(telescope, "id", 7L);
        TelescopeRepository telescopes = mock(TelescopeRepository.class);
        when(telescopes.findAll()).thenReturn(List.of(telescope));
        ConditionsFeed feed = new ConditionsFeed() {
            @Override
            public PluginDescriptor descriptor() {
                return new PluginDescriptor("test-forecast", "Test forecast", "1.0", PluginApi.VERSION);
            }

            @Override
            public List<SiteCondition> conditions(LocalDate from, LocalDate to) {
                return List.of(new SiteCondition("Ridge Site", null, NIGHT, closed, cloud, ""));
            }
        };

        ConditionsClosures.Closures closures = new ConditionsClosures(PluginRegistry.of(List.of(feed)), telescopes, limit)
                .between(NIGHT, NIGHT);

        assertThat(closures.notes()).isEmpty();
        if (expectClosed) {
            assertThat(closures.nights()).singleElement().satisfies(n -> {
                assertThat(n.getTelescopeId()).isEqualTo(7L);
                assertThat(n.getNight()).isEqualTo(NIGHT);
                assertThat(n.getState()).isEqualTo(PlanNight.State.CLOSED);
                assertThat(n.getReason()).startsWith("conditions feed test-forecast: ");
            });
        } else {
            assertThat(closures.nights()).isEmpty();
        }
    }
}
