package org.skyrota.sky.coords;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * Sexagesimal notation: 1 h of right ascension is 15 degrees, 1 degree is 60 minutes of arc and
 * 3600 seconds (common practice, no source). The star of Meeus Example 21.b has
 * α = 2h44m11.986s, δ = +49°13′42.48″ (Meeus, Astronomical Algorithms, 2nd ed., Ex. 21.b).
 */
class SexagesimalTest {

    private static final double MEEUS_21B_RA_DEG = (2 + 44 / 60.0 + 11.986 / 3600) * 15;
    private static final double MEEUS_21B_DEC_DEG = 49 + 13 / 60.0 + 42.48 / 3600;

    @ParameterizedTest
    @ValueSource(strings = {"02:44:11.986", "2 44 11.986", "2h44m11.986s", "02h 44m 11.986s", " 2:44:11.986 "})
    void rightAscensionInEveryNotation(String text) {
        assertThat(Sexagesimal.parseRaDeg(text)).isCloseTo(MEEUS_21B_RA_DEG, within(1e-9));
    }

    @ParameterizedTest
    @ValueSource(strings = {"+49:13:42.48", "49 13 42.48", "49d13m42.48s", "+49°13′42.48″", "49°13'42.48\""})
    void declinationInEveryNotation(String text) {
        assertThat(Sexagesimal.parseDecDeg(text)).isCloseTo(MEEUS_21B_DEC_DEG, within(1e-9));
    }

    @ParameterizedTest
    @CsvSource({
        "-00:30:00, -0.5",
        "-0 30 00, -0.5",
        "-00:00:36, -0.01",
        "+00:30:00, 0.5",
        "-12:30, -12.5",
        "-12.25, -12.25",
        "90, 90",
        "-90:00:00, -90",
    })
    void theSignBelongsToTheWholeAngle(String text, double expectedDeg) {
        assertThat(Sexagesimal.parseDecDeg(text)).isCloseTo(expectedDeg, within(1e-12));
    }

    @ParameterizedTest
    @CsvSource({"187.25, 187.25", "0, 0", "12:30, 187.5", "12:29.5, 187.375", "23:59:59.999, 359.9999958333"})
    void bareNumbersAreDegreesAndSeparatorsMeanHours(String text, double expectedDeg) {
        assertThat(Sexagesimal.parseRaDeg(text)).isCloseTo(expectedDeg, within(1e-9));
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "24:00:00|below 24",
        "360|below 360",
        "-1|below 360",
        "-01:00:00|negative",
        "12:60:00|minutes must be below 60",
        "12:30:60|seconds must be below 60",
        "12d30m|not degrees",
        "12:3x:00|hh:mm:ss.s",
        "twelve|hh:mm:ss.s",
        "12.5:30:00|only the last field",
    })
    void badRightAscensionsSayWhatIsWrong(String text, String reason) {
        assertThatThrownBy(() -> Sexagesimal.parseRaDeg(text))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining(reason)
                .hasMessageContaining(text);
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "+90:00:01|between -90 and +90",
        "-91|between -90 and +90",
        "12:60:00|minutes must be below 60",
        "12h30m|not hours",
        "NaN|±dd:mm:ss",
    })
    void badDeclinationsSayWhatIsWrong(String text, String reason) {
        assertThatThrownBy(() -> Sexagesimal.parseDecDeg(text))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining(reason);
    }

    @Test
    void blankIsRefused() {
        assertThatThrownBy(() -> Sexagesimal.parseRaDeg(" ")).hasMessageContaining("blank");
        assertThatThrownBy(() -> Sexagesimal.parseDecDeg(null)).hasMessageContaining("blank");
    }

    @Test
    void formatting() {
        assertThat(Sexagesimal.formatRa(MEEUS_21B_RA_DEG, 3)).isEqualTo("02:44:11.986");
        assertThat(Sexagesimal.formatDec(MEEUS_21B_DEC_DEG, 2)).isEqualTo("+49:13:42.48");
        assertThat(Sexagesimal.formatDec(-0.5, 0)).isEqualTo("-00:30:00");
        assertThat(Sexagesimal.formatDec(-0.00001, 0)).isEqualTo("+00:00:00");
        // rounding carries into the minutes and hours, and 24h wraps to 0h
        assertThat(Sexagesimal.formatRa(15 * (1 + 59 / 60.0 + 59.96 / 3600), 1)).isEqualTo("02:00:00.0");
        assertThat(Sexagesimal.formatRa(359.99999999, 1)).isEqualTo("00:00:00.0");
        assertThat(Sexagesimal.formatDec(90, 1)).isEqualTo("+90:00:00.0");
    }

    @Test
    void formatThenParseGivesTheSameAngle() {
        for (double ra = 0; ra < 360; ra += 7.123456) {
            assertThat(Sexagesimal.parseRaDeg(Sexagesimal.formatRa(ra, 4))).isCloseTo(ra, within(0.00005 * 15 / 3600 * 1.01));
        }
        for (double dec = -90; dec <= 90; dec += 3.3333) {
            assertThat(Sexagesimal.parseDecDeg(Sexagesimal.formatDec(dec, 3))).isCloseTo(dec, within(0.0005 / 3600 * 1.01));
        }
    }
}
