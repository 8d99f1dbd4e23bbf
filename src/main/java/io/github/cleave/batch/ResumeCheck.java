package io.github.cleave.batch;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import io.github.cleave.io.Checksums;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.io.TimeAxis;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Decides whether an input's outputs are complete from an earlier run, so that a rerun keeps them:
 * its {@code NAME.record.json} (written last, atomically) exists, every other output exists, and
 * the record names the same model, the same image and the same seed file contents (SHA-256) as this
 * run, and, for a time-lapse, the same time settings (time axis asked for, seeded time point, seeds
 * from the neighbour) and its class map where it has classes; a record of one time point made with
 * a time axis other than {@code AUTO} or now asked for another is not trusted for a stack. Anything
 * else, including an unreadable record, means "segment it again". A time-lapse's counts are those
 * of all its time points.
 */
final class ResumeCheck {
  /** Outputs of one image besides the record (DESIGN.md names). */
  static final List<String> OUTPUTS =
      List.of(".mask.tif", ".labels.tif", ".objects.csv", ".rois.zip", ".overlay.png");

  private ResumeCheck() {}

  /** What the record of complete outputs says. */
  record Done(int objects, double timeMs) {}

  static Optional<Done> completed(
      Path outDir, String name, Path image, Path seedFile, String modelSha256, BatchSettings run) {
    Path record = SegmentationFiles.recordFile(outDir, name);
    if (!Files.isRegularFile(record)) {
      return Optional.empty();
    }
    for (String suffix : OUTPUTS) {
      if (!Files.isRegularFile(outDir.resolve(name + suffix))) {
        return Optional.empty();
      }
    }
    try {
      JsonObject o = JsonParser.parseString(Files.readString(record)).getAsJsonObject();
      JsonObject input = o.getAsJsonObject("input");
      if (!modelSha256.equals(sha(input, "model"))
          || !Checksums.sha256(image).equals(sha(input, "image"))
          || !Objects.equals(
              seedFile == null ? null : Checksums.sha256(seedFile), sha(input, "seeds"))) {
        return Optional.empty();
      }
      JsonObject result = o.getAsJsonObject("result");
      if (result.has("classes") && !Files.isRegularFile(outDir.resolve(name + ".classes.tif"))) {
        return Optional.empty();
      }
      JsonObject time = o.getAsJsonObject("timeLapse");
      if (time != null) {
        if (!run.timeAxis().name().equals(time.get("requestedTimeAxis").getAsString())
            || time.get("seededTimePoint").getAsInt() != run.seedFrame() + 1
            || time.get("seedsFromNeighbour").getAsBoolean() != run.seedsFromNeighbour()) {
          return Optional.empty();
        }
        return Optional.of(
            new Done(
                time.get("objectsAllTimePoints").getAsInt(),
                time.get("timeMsAllTimePoints").getAsDouble()));
      }
      if (run.timeAxis() != TimeAxis.AUTO && input.get("planes").getAsInt() > 1) {
        return Optional.empty(); // a stack now read with a chosen time axis: decide it again
      }
      JsonObject timings = o.getAsJsonObject("timingsMs");
      return Optional.of(
          new Done(result.get("objects").getAsInt(), timings.get("total").getAsDouble()));
    } catch (IOException | RuntimeException e) {
      return Optional.empty();
    }
  }

  private static String sha(JsonObject input, String key) {
    JsonElement e = input.get(key);
    if (e == null || !e.isJsonObject()) {
      return null;
    }
    JsonElement s = e.getAsJsonObject().get("sha256");
    return s == null ? null : s.getAsString();
  }
}
