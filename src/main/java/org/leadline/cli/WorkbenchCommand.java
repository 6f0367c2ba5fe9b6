package org.leadline.cli;

import org.leadline.workbench.Workbench;
import org.leadline.workbench.WorkbenchFrame;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

/** {@code workbench [PROJECT.yaml]}: opens the Swing front end and waits until it is closed. */
@Command(name = "workbench", mixinStandardHelpOptions = true,
        description = {"Open the workbench: review casts, lines and soundings, reject or restore pings, build the surface.",
                "Not for navigation unless validated by a qualified hydrographer."})
final class WorkbenchCommand implements Callable<Integer> {
    @Parameters(index = "0", arity = "0..1", paramLabel = "PROJECT.yaml", description = "Project file to open (optional).")
    Path projectFile;

    @Spec CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        if (projectFile != null && !Files.isRegularFile(projectFile)) {
            throw new java.nio.file.NoSuchFileException(projectFile.toString());
        }
        if (java.awt.GraphicsEnvironment.isHeadless()) {
            spec.commandLine().getErr().println("leadline: the workbench needs a graphical display"
                    + " (DISPLAY is not set or java.awt.headless is true)");
            spec.commandLine().getErr().flush();
            return Main.INTERNAL_ERROR;
        }
        WorkbenchFrame f = Workbench.start(projectFile);
        f.awaitClosed();
        return Main.OK;
    }
}
