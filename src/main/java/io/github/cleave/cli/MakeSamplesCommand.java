package io.github.cleave.cli;

import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code cleave make-samples}: writes the invented sample images with seeds and ground truth. */
@Command(
    name = "make-samples",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Writes the invented sample images (simulated fluorescent nuclei, a stained-section-like"
          + " RGB image, a two-channel image, an anisotropic 3D stack), each as NAME.tif with"
          + " NAME.seeds.tif (generated strokes) and NAME.truth.tif (ground-truth mask). The same"
          + " seed always gives the same files. These are the bundled sample-images.",
      "Exit codes: 0 done; 2 bad arguments or files exist without --force."
    })
final class MakeSamplesCommand implements Callable<Integer> {
  @Option(
      names = "--out",
      paramLabel = "FOLDER",
      defaultValue = "sample-images",
      description = "Folder to write into, created if missing (default: ${DEFAULT-VALUE}).")
  Path out;

  @Option(
      names = "--seed",
      paramLabel = "S",
      defaultValue = "" + SamplePhantoms.DEFAULT_SEED,
      description = "Random seed of the recipes (default: ${DEFAULT-VALUE}, the bundled samples).")
  long seed;

  @Option(names = "--force", description = "Replace existing sample files.")
  boolean force;

  @Spec CommandSpec spec;

  @Override
  public Integer call() throws IOException {
    List<Phantom> phantoms = SamplePhantoms.all(seed);
    if (!force) {
      for (Phantom p : phantoms) {
        Path existing = out.resolve(p.name() + ".tif");
        if (Files.exists(existing)) {
          throw new InputException(existing + " exists: use --force to replace the samples");
        }
      }
    }
    Files.createDirectories(out);
    SampleWriter.writeAll(phantoms, out);
    for (Phantom p : phantoms) {
      spec.commandLine().getOut().println("wrote " + out.resolve(p.name() + ".tif"));
    }
    return ExitCodes.OK;
  }
}
