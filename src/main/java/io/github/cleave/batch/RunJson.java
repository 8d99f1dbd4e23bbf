package io.github.cleave.batch;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import io.github.cleave.io.AtomicFiles;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.render.DisplayRange;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SoftwareVersion;
import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

/**
 * The JSON files that describe a run: {@code run.started.json} (format {@code cleave-batch-start}:
 * model path and SHA-256, display ranges, start time), written before the first image, and {@code
 * run.json} (format {@code cleave-batch-run}: versions, model, every setting of the run and of the
 * model, display ranges, start and end, counts, notes, and one entry per file with its status),
 * written last as the run's completion marker. Both atomically.
 */
final class RunJson {
  private static final Gson GSON =
      new GsonBuilder().setPrettyPrinting().serializeSpecialFloatingPointValues().create();

  private RunJson() {}

  static void writeStarted(
      Path out, Path model, String modelSha256, DisplayRange[] ranges, Instant started)
      throws IOException {
    JsonObject o = new JsonObject();
    o.addProperty("format", "cleave-batch-start");
    o.addProperty("formatVersion", 1);
    o.addProperty("model", model.toString());
    o.addProperty("modelSha256", modelSha256);
    o.add("displayRanges", RunMarkers.rangesToJson(ranges));
    o.addProperty("started", started.toString());
    write(out.resolve(RunMarkers.STARTED), o);
  }

  static void writeRun(
      BatchSettings s,
      SegmentationModel model,
      String modelSha256,
      DisplayRange[] ranges,
      BatchResult result)
      throws IOException {
    JsonObject o = new JsonObject();
    o.addProperty("format", "cleave-batch-run");
    o.addProperty("formatVersion", 1);
    JsonObject versions = new JsonObject();
    versions.addProperty("cleave", SoftwareVersion.get());
    versions.addProperty("imagej", ij.IJ.getVersion());
    versions.addProperty("java", System.getProperty("java.version"));
    o.add("versions", versions);
    JsonObject m = new JsonObject();
    m.addProperty("path", s.model().toString());
    m.addProperty("sha256", modelSha256);
    m.addProperty("learnedBy", model.softwareVersion());
    o.add("model", m);
    JsonObject settings = new JsonObject();
    settings.addProperty("in", s.in().toString());
    settings.addProperty("out", s.out().toString());
    settings.addProperty("seeds", s.seeds() == null ? null : s.seeds().toString());
    settings.addProperty("pattern", s.pattern());
    settings.addProperty("recursive", s.recursive());
    settings.addProperty("overwrite", s.overwrite());
    settings.addProperty("threads", s.threads());
    o.add("settings", settings);
    o.add("modelSettings", ModelFiles.settingsToJson(model.settings()));
    o.add("displayRanges", RunMarkers.rangesToJson(ranges));
    o.addProperty("started", result.started().toString());
    o.addProperty("finished", result.finished().toString());
    JsonObject counts = new JsonObject();
    counts.addProperty("files", result.files().size());
    counts.addProperty("ok", result.files().size() - result.failedCount());
    counts.addProperty("failed", result.failedCount());
    counts.addProperty("kept", result.reusedCount());
    o.add("counts", counts);
    JsonArray notes = new JsonArray();
    result.notes().forEach(notes::add);
    o.add("notes", notes);
    o.add("files", files(result.files()));
    write(s.out().resolve(RunMarkers.RUN), o);
  }

  private static JsonArray files(List<FileOutcome> files) {
    JsonArray a = new JsonArray();
    for (FileOutcome f : files) {
      JsonObject e = new JsonObject();
      e.addProperty("file", f.file());
      e.addProperty("status", f.failed() ? "failed" : "ok");
      if (!f.failed()) {
        e.addProperty("objects", f.objectCount());
        e.addProperty("kept", f.reused());
      }
      if (!f.message().isEmpty()) {
        e.addProperty("message", f.message());
      }
      e.addProperty("timeMs", f.timeMs());
      a.add(e);
    }
    return a;
  }

  private static void write(Path file, JsonObject o) throws IOException {
    byte[] bytes = RunMarkers.utf8(GSON.toJson(o) + "\n");
    AtomicFiles.write(file, out -> out.write(bytes));
  }
}
