package org.evanesce.io.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.evanesce.io.output.BuildInfo;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.OutputFolders;
import org.evanesce.io.output.OutputRefusedException;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.run.RunOutputs;
import org.evanesce.io.sweep.DipShift;
import org.evanesce.io.sweep.SweepDips;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code evanesce dip-shift}: a sensor's sensitivity from two merged sweeps that differ in one material's index. */
@Command(name = "dip-shift", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"A sensor's sensitivity from two separate sweeps: both over the same angles, one material's index "
                + "changed between them (e.g. evanesce sweep CASE --set n_water=1.3321 --out A, then --set n_water=1.3421 "
                + "--out B). Reads each folder's sweep-extrema.csv and the case its points ran (run.json), finds what differs "
                + "(exactly one material's index; anything else is refused), and prints and writes, per wavelength and flux "
                + "column, the two dips' angles and the shift in degrees per refractive-index unit, (dip_B - dip_A)/(n_B - n_A).",
            "Writes dip-shift.csv and dip-shift.json into a new results folder (--out), never into the sweeps' folders."})
public final class DipShiftCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "A", description = "The first sweep's folder (merged: sweep.json, sweep-extrema.csv).")
    private Path first;

    @Parameters(index = "1", paramLabel = "B", description = "The second sweep's folder.")
    private Path second;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "The results folder to write (new, or empty).")
    private Path out;

    @Option(names = "--force", description = "Replace an existing results folder of dip-shift (only once the new one is written).")
    private boolean force;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Path folder = out.toAbsolutePath().normalize();
        try {
            SweepDips a = SweepDips.read(first);
            SweepDips b = SweepDips.read(second);
            if (a.dir().toAbsolutePath().normalize().equals(b.dir().toAbsolutePath().normalize())) {
                throw new DipShift.Mismatch("A and B are the same folder (" + a.dir() + "); expected two sweeps");
            }
            List<OutputFolders.Protected> protect = new ArrayList<>(OutputFolders.around(null));
            for (SweepDips s : List.of(a, b)) {
                Path in = s.dir().toAbsolutePath().normalize();
                if (folder.startsWith(in)) {
                    throw new OutputRefusedException(folder + ": " + (folder.equals(in) ? "is" : "lies in") + " the sweep folder " + in
                            + "; dip-shift writes only into a folder of its own outside its inputs. Choose another --out");
                }
                protect.add(new OutputFolders.Protected(in, "a sweep folder it reads"));
            }
            DipShift.Result r = DipShift.compare(a, b);
            OutputFolders.checkResults(folder, force, protect);
            Path written;
            try (RunFolder rf = RunFolder.begin(folder, force, protect)) {
                rf.cleaned().forEach(line -> o.println("note: " + line));
                rf.writeText(DipShift.CSV, DipShift.csv(r));
                rf.writeText(DipShift.JSON, Json.write(DipShift.record(r, BuildInfo.current().version(), RunOutputs.CAUTION)));
                rf.commit();
                written = rf.target();
            }
            o.print(DipShift.summary(r));
            r.notes().forEach(n -> err.println("evanesce dip-shift: note: " + n));
            o.println("results: " + written);
            o.println("Caution: " + RunOutputs.CAUTION);
            return ExitCode.OK;
        } catch (SweepDips.Unusable | DipShift.Mismatch e) {
            err.println("evanesce dip-shift: " + e.getMessage());
            err.println("evanesce dip-shift: nothing was written (see 'evanesce dip-shift --help')");
            return ExitCode.USAGE;
        }
    }
}
