package org.leadline.cli;

import java.util.List;

/** The list of subcommands; each front-end command is one class in this package. */
final class Commands {
    private Commands() {}

    static List<Object> all() {
        return List.of(
                // add new commands here, one per line, to keep merges simple
                new CastCommand()
        );
    }
}
