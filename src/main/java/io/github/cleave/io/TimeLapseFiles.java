package io.github.cleave.io;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import ij.gui.Roi;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.render.OverlayPicture;
import io.github.cleave.segment.ClassMap;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.TimeLapseFrame;
import io.github.cleave.segment.TimeLapseResult;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes the outputs of a time-lapse under the names of one image ({@link SegmentationFiles}), each
 * holding every time point: {@code NAME.mask.tif}, {@code NAME.labels.tif} (tracked numbers: a cell
 * keeps its number from frame to frame) and, for three or more classes, {@code NAME.classes.tif},
 * as hyperstacks with the time axis and the frame interval ({@link TimeLapseOutputs}); {@code
 * NAME.objects.csv} with a leading {@code frame} column (and {@code time_s} or the like when the
 * frame interval is known); {@code NAME.rois.zip} with one ROI per object, plane and time point
 * ({@link RoiExport#roisOfFrame}); {@code NAME.overlay.png}, the seeded (or first) time point; and,
 * last, {@code NAME.record.json} with a {@code timeLapse} section (time points, how the time axis
 * was chosen, objects per time point). Every file is written atomically; none may be an input file.
 */
public final class TimeLapseFiles {
  private TimeLapseFiles() {}

  /**
   * Writes every output of {@code result} for the time-lapse {@code series}.
   *
   * @param seeds the seeds of the seeded time point, drawn on the overlay (may be null)
   * @param axis the time axis asked for, and {@code seedsFromNeighbour} whether time points were
   *     seeded from their neighbours: both go into the record, so a rerun can tell
   * @return the overlay picture written
   */
  public static BufferedImage write(
      Path outDir,
      String name,
      OpenedSeries series,
      SeedLabels seeds,
      TimeLapseResult result,
      SegmentationFiles.Inputs inputs,
      String command,
      TimeAxis axis,
      boolean seedsFromNeighbour)
      throws IOException {
    List<Path> protectedFiles = SegmentationFiles.inputList(inputs);
    Path mask = outDir.resolve(name + ".mask.tif");
    Path labels = outDir.resolve(name + ".labels.tif");
    Path classMap = outDir.resolve(name + ".classes.tif");
    Path csv = outDir.resolve(name + ".objects.csv");
    Path rois = outDir.resolve(name + ".rois.zip");
    Path overlay = outDir.resolve(name + ".overlay.png");
    Path record = SegmentationFiles.recordFile(outDir, name);
    for (Path p : List.of(mask, labels, classMap, csv, rois, overlay, record)) {
      ImageOutputs.checkNotInput(p, protectedFiles);
    }
    Files.deleteIfExists(record);
    TimeLapseGeometry geometry = series.geometry();
    List<byte[]> masks = new ArrayList<>();
    List<int[]> tracked = new ArrayList<>();
    List<byte[]> classes = new ArrayList<>();
    List<Roi> roiList = new ArrayList<>();
    int largest = 0;
    Segmentation first = result.frame(result.seedFrame()).segmentation();
    boolean stack = geometry.depth() > 1;
    StringBuilder table =
        new StringBuilder(ObjectsCsv.frameHeader(series.frameInterval(), series.timeUnit()));
    table
        .append(
            ObjectsCsv.header(
                stack,
                first.voxelSize().unit(),
                SegmentationFiles.measuredChannels(first, series.channelCount()),
                false,
                first.isMultiClass()))
        .append('\n');
    for (TimeLapseFrame f : result.frames()) {
      Segmentation s = f.segmentation();
      masks.add(s.mask());
      int[] numbers = f.trackedLabels();
      tracked.add(numbers);
      for (int k = 1; k < f.numberOf().length; k++) {
        largest = Math.max(largest, f.numberOf()[k]);
      }
      ClassMap c = s.classes();
      int[] objectClasses = c == null ? null : c.objectClasses();
      if (c != null) {
        classes.add(c.labels());
      }
      roiList.addAll(RoiExport.roisOfFrame(s.objects(), objectClasses, f.numberOf(), f.index()));
      ObjectsCsv.frameRows(
          table, f.index(), series.frameInterval(), f.measurements(), stack, f.classOfTracked());
    }
    TimeLapseOutputs.writeMasks(mask, masks, geometry);
    TimeLapseOutputs.writeLabels(labels, tracked, largest, geometry);
    if (first.isMultiClass()) {
      TimeLapseOutputs.writeClassMaps(classMap, classes, geometry);
    } else {
      Files.deleteIfExists(classMap);
    }
    byte[] csvBytes = table.toString().getBytes(StandardCharsets.UTF_8);
    AtomicFiles.write(csv, out -> out.write(csvBytes));
    byte[] zip = RoiExport.zip(roiList);
    AtomicFiles.write(rois, out -> out.write(zip));
    int t = result.seedFrame();
    LoadedImage loaded = series.loadedFrame(t);
    Raster raster = loaded.raster();
    TimeLapseFrame shown = result.frame(t);
    BufferedImage picture =
        OverlayPicture.render(
            raster,
            SegmentationFiles.displayChannels(raster, first),
            null,
            shown.segmentation().mask(),
            shown.trackedLabels(),
            seeds);
    ImageOutputs.writePng(overlay, picture);
    byte[] json =
        RunRecord.json(
            name,
            loaded,
            inputs,
            shown.segmentation(),
            command,
            timeLapseSection(series, result, axis, seedsFromNeighbour));
    AtomicFiles.write(record, out -> out.write(json));
    return picture;
  }

  private static JsonObject timeLapseSection(
      OpenedSeries series, TimeLapseResult result, TimeAxis axis, boolean seedsFromNeighbour) {
    JsonObject o = new JsonObject();
    o.addProperty("timePoints", result.frameCount());
    o.addProperty("seededTimePoint", result.seedFrame() + 1);
    o.addProperty("requestedTimeAxis", axis.name());
    o.addProperty("seedsFromNeighbour", seedsFromNeighbour);
    int objects = 0;
    double ms = 0;
    for (TimeLapseFrame f : result.frames()) {
      objects += f.objectCount();
      ms += f.segmentation().timings().totalMs();
    }
    o.addProperty("objectsAllTimePoints", objects);
    o.addProperty("timeMsAllTimePoints", ms);
    o.addProperty("timeAxis", series.timeSource().name());
    o.addProperty("timeAxisReason", series.reason());
    o.addProperty("frameInterval", series.frameInterval());
    o.addProperty("timeUnit", series.timeUnit());
    JsonArray perFrame = new JsonArray();
    for (TimeLapseFrame f : result.frames()) {
      JsonObject entry = new JsonObject();
      entry.addProperty("timePoint", f.index() + 1);
      entry.addProperty("objects", f.objectCount());
      entry.addProperty("foregroundVoxels", f.segmentation().foregroundCount());
      entry.addProperty("energyNats", f.segmentation().energy());
      perFrame.add(entry);
    }
    o.add("perTimePoint", perFrame);
    JsonArray warnings = new JsonArray();
    series.warnings().forEach(warnings::add);
    o.add("timeAxisWarnings", warnings);
    return o;
  }
}
