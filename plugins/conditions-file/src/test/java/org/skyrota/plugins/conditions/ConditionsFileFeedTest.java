package org.skyrota.plugins.conditions;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.tuple;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.SiteCondition;

/** The conditions file against its own documented format; sites and nights are invented. */
class ConditionsFileFeedTest {

    @TempDir
    Path dir;

    private Path file(String text) throws IOException {
        return Files.writeString(dir.resolve("conditions.csv"), text);
    }

    private static final LocalDate MAR_1 = LocalDate.of(2027, 3, 1);

    @Test
    void readsClosuresAndCloudCoverWithinTheRange() throws Exception {
        ConditionsFileFeed feed = new ConditionsFileFeed(file("""
                # conditions for the first week of March
                site,telescope,night,closed,cloud_fraction,reason
                Ridge Site,,2027-03-01,yes,,"dome maintenance, all night"
                Lake Site,T25,2027-03-02,no,0.8,forecast mostly cloudy

                Lake Site,,2027-03-02,no,0.2,forecast
                Ridge Site,,2027-02-27,yes,1,outside the range asked for
                """));

        List<SiteCondition> conditions = feed.conditions(MAR_1, MAR_1.plusDays(6));

        assertThat(conditions).containsExactly(
                new SiteCondition("Ridge Site", null, MAR_1, true, null, "dome maintenance, all night"),
                new SiteCondition("Lake Site", "T25", MAR_1.plusDays(1), false, 0.8, "forecast mostly cloudy"),
                new SiteCondition("Lake Site", null, MAR_1.plusDays(1), false, 0.2, "forecast"));
        assertThat(feed.conditions(MAR_1.plusDays(1), MAR_1.plusDays(1))).hasSize(2);
    }

    @Test
    void everyBadLineIsReportedByNumberAndNothingIsReturned() throws Exception {
        ConditionsFileFeed feed = new ConditionsFileFeed(file("""
                site,night,closed,cloud_fraction,reason
                Ridge Site,2027-03-01,yes,,ok
                Ridge Site,2027-03-32,yes,,bad date
                ,2027-03-02,maybe,1.5,three bad cells
                Ridge Site,2027-03-01,no,0.1,same night again
                Short row
                Lake Site,2027-03-05,no,0.3,ok
                """));

        assertThatThrownBy(() -> feed.conditions(MAR_1, MAR_1.plusDays(6)))
                .isInstanceOf(ConditionsFileException.class)
                .hasMessageContaining("line 3, night")
                .satisfies(e -> assertThat(((ConditionsFileException) e).problems())
                        .extracting(ImportProblem::line, ImportProblem::field)
                        .containsExactly(
                                tuple(3, "night"),
                                tuple(4, "site"), tuple(4, "closed"), tuple(4, "cloud_fraction"),
                                tuple(5, null),
                                tuple(6, null)));
    }

    @Test
    void headerProblemsAndMissingFiles() throws Exception {
        ConditionsFileFeed badHeader = new ConditionsFileFeed(file("site,night,shut,reason\nA,2027-03-01,yes,x\n"));
        assertThatThrownBy(() -> badHeader.conditions(MAR_1, MAR_1))
                .isInstanceOf(ConditionsFileException.class)
                .satisfies(e -> assertThat(((ConditionsFileException) e).problems()).extracting(ImportProblem::field)
                        .containsExactly("shut", "closed", "cloud_fraction"));

        ConditionsFileFeed missing = new ConditionsFileFeed(dir.resolve("nope.csv"));
        assertThatThrownBy(() -> missing.conditions(MAR_1, MAR_1)).isInstanceOf(NoSuchFileException.class);
    }

    @Test
    void withoutAConfiguredFileItKnowsNothingAndIsFoundThroughItsServicesFile() throws Exception {
        PluginRegistry registry = PluginRegistry.load(getClass().getClassLoader());
        assertThat(registry.problems()).isEmpty();
        assertThat(registry.conditionsFeeds()).singleElement().isInstanceOf(ConditionsFileFeed.class);
        ConditionsFileFeed unconfigured = (ConditionsFileFeed) registry.conditionsFeeds().get(0);
        if (unconfigured.file().isEmpty()) {
            assertThat(unconfigured.conditions(MAR_1, MAR_1.plusDays(30))).isEmpty();
        }
        assertThat(new ConditionsFileFeed(null).conditions(MAR_1, MAR_1)).isEmpty();
    }

    @Test
    void theSystemPropertyNamesTheFile() throws Exception {
        Path f = file("site,night,closed,cloud_fraction,reason\nRidge Site,2027-03-01,yes,,closed\n");
        String old = System.getProperty(ConditionsFileFeed.PATH_PROPERTY);
        System.setProperty(ConditionsFileFeed.PATH_PROPERTY, f.toString());
        try {
            assertThat(new ConditionsFileFeed().conditions(MAR_1, MAR_1)).extracting(SiteCondition::closed).containsExactly(true);
        } finally {
            if (old == null) {
                System.clearProperty(ConditionsFileFeed.PATH_PROPERTY);
            } else {
                System.setProperty(ConditionsFileFeed.PATH_PROPERTY, old);
            }
        }
    }

    @Test
    void theDefaultPlaceIsReadWheneverTheFileExistsAndAFileNamedOutrightMustExist() throws Exception {
        Path later = dir.resolve("conditions.csv");
        String oldPath = System.getProperty(ConditionsFileFeed.PATH_PROPERTY);
        String oldDefault = System.getProperty(ConditionsFileFeed.DEFAULT_PATH_PROPERTY);
        System.clearProperty(ConditionsFileFeed.PATH_PROPERTY);
        System.setProperty(ConditionsFileFeed.DEFAULT_PATH_PROPERTY, later.toString());
        try {
            // Made before the file exists, as the server makes it at its start.
            ConditionsFileFeed feed = new ConditionsFileFeed();
            assertThat(feed.file()).contains(later);
            assertThat(feed.conditions(MAR_1, MAR_1)).isEmpty();
            // Written afterwards: the next read finds it, and a change after that too.
            file("site,night,closed,cloud_fraction,reason\nRidge Site,2027-03-01,no,0.95,forecast overcast\n");
            assertThat(feed.conditions(MAR_1, MAR_1)).extracting(SiteCondition::cloudFraction).containsExactly(0.95);
            file("site,night,closed,cloud_fraction,reason\nRidge Site,2027-03-01,no,0.5,forecast half cloudy\n");
            assertThat(feed.conditions(MAR_1, MAR_1)).extracting(SiteCondition::cloudFraction).containsExactly(0.5);
            Files.delete(later);
            assertThat(feed.conditions(MAR_1, MAR_1)).isEmpty();

            // A file named outright wins over the default place, and its absence is an error.
            System.setProperty(ConditionsFileFeed.PATH_PROPERTY, dir.resolve("named.csv").toString());
            ConditionsFileFeed named = new ConditionsFileFeed();
            assertThat(named.file()).contains(dir.resolve("named.csv"));
            assertThatThrownBy(() -> named.conditions(MAR_1, MAR_1)).isInstanceOf(NoSuchFileException.class);
        } finally {
            restore(ConditionsFileFeed.PATH_PROPERTY, oldPath);
            restore(ConditionsFileFeed.DEFAULT_PATH_PROPERTY, oldDefault);
        }
    }

    private static void restore(String property, String value) {
        if (value == null) {
            System.clearProperty(property);
        } else {
            System.setProperty(property, value);
        }
    }
}
