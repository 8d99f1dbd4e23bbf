package io.github.cleave.io;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import io.github.cleave.image.Raster;
import io.github.cleave.segment.ClassMap;
import io.github.cleave.segment.PhaseTimings;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SoftwareVersion;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/**
 * The record of one segmentation ({@code NAME.record.json}): what was segmented (file, size,
 * channels, SHA-256 of the image, seed and model files), with which settings and resolved values,
 * by which versions of Cleave, ImageJ and Java, what came out (flow value = cut value, energy,
 * foreground voxels, objects) and how long each phase took, and the warnings. Enough to reproduce
 * the run and to check that its inputs are unchanged.
 */
final class RunRecord {
  private static final Gson GSON =
      new GsonBuilder().setPrettyPrinting().serializeSpecialFloatingPointValues().create();

  private RunRecord() {}

  static byte[] json(
      String name,
      LoadedImage image,
      SegmentationFiles.Inputs inputs,
      Segmentation result,
      String command)
      throws IOException {
    return json(name, image, inputs, result, command, null);
  }

  /** The record, with a {@code timeLapse} section when {@code timeLapse} is not null. */
  static byte[] json(
      String name,
      LoadedImage image,
      SegmentationFiles.Inputs inputs,
      Segmentation result,
      String command,
      JsonObject timeLapse)
      throws IOException {
    JsonObject o = new JsonObject();
    o.addProperty("format", "cleave-record");
    o.addProperty("formatVersion", 1);
    o.addProperty("name", name);
    o.addProperty("command", command);
    JsonObject versions = new JsonObject();
    versions.addProperty("cleave", SoftwareVersion.get());
    versions.addProperty("imagej", ij.IJ.getVersion());
    versions.addProperty("java", System.getProperty("java.version"));
    o.add("versions", versions);
    Raster r = image.raster();
    JsonObject in = new JsonObject();
    in.add("image", fileEntry(inputs.image()));
    in.add("seeds", fileEntry(inputs.seeds()));
    in.add("model", fileEntry(inputs.model()));
    in.addProperty("width", r.width());
    in.addProperty("height", r.height());
    in.addProperty("planes", r.depth());
    in.addProperty("channels", r.channelCount());
    in.addProperty("pixelKind", r.kind().name());
    in.add("voxelSize", ModelFiles.voxelSizeToJson(result.voxelSize()));
    o.add("input", in);
    SegmentationModel model = result.model();
    o.add("settings", ModelFiles.settingsToJson(model.settings()));
    JsonObject resolved = new JsonObject();
    resolved.addProperty("contrastScale", model.contrastScale());
    resolved.addProperty("flattenIllumination", model.flatten());
    resolved.addProperty("lightBackground", model.lightBackground());
    o.add("resolved", resolved);
    JsonObject out = new JsonObject();
    out.addProperty("flowValue", result.flowValue());
    out.addProperty("cutValue", result.flowValue());
    out.addProperty("energyNats", result.energy());
    out.addProperty("foregroundVoxels", result.foregroundCount());
    out.addProperty("objects", result.objects().count());
    if (result.isMultiClass()) {
      ClassMap classes = result.classes();
      out.addProperty("classes", classes.classCount());
      JsonObject perClass = new JsonObject();
      for (int c : classes.objectForming()) {
        perClass.addProperty(Integer.toString(c), classes.objectCount(c));
      }
      out.add("objectsPerClass", perClass);
    }
    o.add("result", out);
    PhaseTimings t = result.timings();
    JsonObject ms = new JsonObject();
    ms.addProperty("flatten", t.flattenMs());
    ms.addProperty("learn", t.learnMs());
    ms.addProperty("costs", t.costsMs());
    ms.addProperty("build", t.buildMs());
    ms.addProperty("solve", t.solveMs());
    ms.addProperty("objects", t.objectsMs());
    ms.addProperty("measure", t.measureMs());
    ms.addProperty("total", t.totalMs());
    o.add("timingsMs", ms);
    JsonArray warnings = new JsonArray();
    result.warnings().forEach(warnings::add);
    o.add("warnings", warnings);
    if (timeLapse != null) {
      o.add("timeLapse", timeLapse);
    }
    return (GSON.toJson(o) + "\n").getBytes(StandardCharsets.UTF_8);
  }

  private static JsonObject fileEntry(Path file) throws IOException {
    if (file == null) {
      return null;
    }
    JsonObject f = new JsonObject();
    f.addProperty("path", file.toString());
    f.addProperty("sha256", Checksums.sha256(file));
    return f;
  }
}
