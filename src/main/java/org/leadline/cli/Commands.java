package org.leadline.cli;

import java.util.ArrayList;
import java.util.List;

/** The list of subcommands; each front-end command is one class in this package. */
final class Commands {
    private Commands() {}

    static List<Object> all() {
        List<Object> c = new ArrayList<>();
        c.add(new BarcheckCommand());
        c.add(new CastCommand());
        c.add(new ProcessCommand());
        c.add(new DemoCommand());
        c.add(new WorkbenchCommand());
        return c;
    }
}
