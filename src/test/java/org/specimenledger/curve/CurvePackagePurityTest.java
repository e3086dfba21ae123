package org.specimenledger.curve;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/** The curve package is part of the pure core: only the JDK and fastdoubleparser. */
class CurvePackagePurityTest {

    @Test
    void curvePackageDependsOnlyOnTheJdkAndFastdoubleparser() {
        JavaClasses curve = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
                .importPackages("org.specimenledger.curve");

        classes().should().onlyDependOnClassesThat()
                .resideInAnyPackage("org.specimenledger.curve..", "java..", "ch.randelshofer.fastdoubleparser..")
                .check(curve);
    }
}
