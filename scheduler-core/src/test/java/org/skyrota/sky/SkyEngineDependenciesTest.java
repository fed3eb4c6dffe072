package org.skyrota.sky;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/** The sky engine's positional astronomy is plain JDK code: no framework, no other Skyrota layer. */
class SkyEngineDependenciesTest {

    private static final JavaClasses SKY = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.skyrota.sky.time", "org.skyrota.sky.coords", "org.skyrota.sky.bodies",
                    "org.skyrota.sky.atmosphere");

    @Test
    void foundationDependsOnlyOnTheJdkAndItself() {
        classes().that().resideInAnyPackage("org.skyrota.sky.time..", "org.skyrota.sky.coords..",
                        "org.skyrota.sky.bodies..", "org.skyrota.sky.atmosphere..")
                .should().onlyDependOnClassesThat()
                .resideInAnyPackage("java..", "org.skyrota.sky.time..", "org.skyrota.sky.coords..",
                        "org.skyrota.sky.bodies..", "org.skyrota.sky.atmosphere..")
                .check(SKY);
    }

    @Test
    void atmosphereNeedsNoEphemeris() {
        classes().that().resideInAPackage("org.skyrota.sky.atmosphere..")
                .should().onlyDependOnClassesThat().resideInAnyPackage("java..", "org.skyrota.sky.atmosphere..")
                .check(SKY);
    }
}
