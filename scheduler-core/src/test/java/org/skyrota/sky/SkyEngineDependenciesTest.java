package org.skyrota.sky;

import static org.assertj.core.api.Assertions.assertThat;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import com.tngtech.archunit.lang.EvaluationResult;
import org.junit.jupiter.api.Test;

/** The sky engine's positional astronomy is plain JDK code: no framework, no other Skyrota layer. */
class SkyEngineDependenciesTest {

    private static final JavaClasses SKY = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.skyrota.sky.time", "org.skyrota.sky.coords", "org.skyrota.sky.bodies",
                    "org.skyrota.sky.atmosphere");

    @Test
    void foundationDependsOnlyOnTheJdkAndItself() {
        assertHolds(classes().that().resideInAnyPackage("org.skyrota.sky.time..", "org.skyrota.sky.coords..",
                        "org.skyrota.sky.bodies..", "org.skyrota.sky.atmosphere..")
                .should().onlyDependOnClassesThat()
                .resideInAnyPackage("java..", "org.skyrota.sky.time..", "org.skyrota.sky.coords..",
                        "org.skyrota.sky.bodies..", "org.skyrota.sky.atmosphere.."),
                SKY);
    }

    @Test
    void atmosphereNeedsNoEphemeris() {
        assertHolds(classes().that().resideInAPackage("org.skyrota.sky.atmosphere..")
                .should().onlyDependOnClassesThat().resideInAnyPackage("java..", "org.skyrota.sky.atmosphere.."),
                SKY);
    }

    /** Evaluates {@code rule} and fails with ArchUnit's report of every violation. */
    private static void assertHolds(ArchRule rule, JavaClasses classes) {
        EvaluationResult result = rule.evaluate(classes);
        assertThat(result.hasViolation()).as(result.getFailureReport().toString()).isFalse();
    }
}
