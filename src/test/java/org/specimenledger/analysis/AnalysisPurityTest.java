package org.specimenledger.analysis;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/** The analysis core is a pure library: JDK only, no frameworks, I/O, logging, clock or randomness. */
class AnalysisPurityTest {

    private final JavaClasses core = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.specimenledger.analysis");

    @Test
    void coreDependsOnNoFrameworkIoOrNondeterminism() {
        noClasses().should().dependOnClassesThat().resideInAnyPackage("org.springframework..", "jakarta..", "javax..",
                "com.fasterxml..", "org.apache..", "org.slf4j..", "java.util.logging..", "java.io..", "java.nio..",
                "java.net..", "java.time..", "java.util.concurrent..")
                .check(core);
        noClasses().should().dependOnClassesThat().haveFullyQualifiedName("java.util.Random").check(core);
        noClasses().should().callMethod(System.class, "currentTimeMillis").check(core);
        noClasses().should().callMethod(System.class, "nanoTime").check(core);
        noClasses().should().callMethod(Math.class, "random").check(core);
    }
}
