package org.evanesce.io.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import org.evanesce.io.Main;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Unmatched;

/**
 * The old name of {@link RedrawCommand}: refused with exit 2 and a message naming {@code redraw}, so
 * that a script written for the old name stops with a clear reason rather than an unknown command.
 */
@Command(name = "render", hidden = true, description = "Renamed: use 'evanesce redraw'.")
public final class RenderRefused implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    /** Whatever followed the old name; only echoed in the message. */
    @Unmatched
    private List<String> arguments = new ArrayList<>();

    /** Prints one line naming {@code redraw} on the error stream; exit 2 (bad usage). */
    @Override
    public Integer call() {
        spec.commandLine().getErr().printf("evanesce render: the command 'render' is now called 'redraw': run 'evanesce redraw "
                + "%s' (it redraws the pictures of a results folder from its HDF5 files)%n",
                arguments.isEmpty() ? "FOLDER" : String.join(" ", arguments));
        return Main.USAGE;
    }
}
