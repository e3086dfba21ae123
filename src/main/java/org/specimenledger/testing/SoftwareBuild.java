package org.specimenledger.testing;

import org.springframework.beans.factory.ObjectProvider;
import org.springframework.boot.info.BuildProperties;
import org.springframework.boot.info.GitProperties;
import org.springframework.stereotype.Component;

/**
 * The running software as the build describes it: application version ({@code META-INF/build-info.properties})
 * and source commit ({@code git.properties}), both written by the Maven build. Never taken from a request.
 * When the build did not write them (a build outside a git checkout), the values say {@code unknown}.
 */
@Component
class SoftwareBuild {

    static final String UNKNOWN = "unknown";

    private final String version;
    private final String commit;

    SoftwareBuild(ObjectProvider<BuildProperties> build, ObjectProvider<GitProperties> git) {
        BuildProperties b = build.getIfAvailable();
        GitProperties g = git.getIfAvailable();
        this.version = b == null || b.getVersion() == null ? UNKNOWN : b.getVersion();
        String id = g == null ? null : g.getCommitId();
        boolean dirty = g != null && "true".equals(g.get("dirty"));
        this.commit = id == null ? UNKNOWN : id + (dirty ? "-dirty" : "");
    }

    String version() {
        return version;
    }

    String commit() {
        return commit;
    }
}
