package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Roi;
import ij.measure.ResultsTable;
import io.github.cleave.io.ImageOutputs;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.segment.ClassMap;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.TimeLapseFrame;
import io.github.cleave.segment.TimeLapseResult;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A segmented time-lapse presented in ImageJ: hyperstacks of one channel, the image's z planes and
 * one frame per time point, for the mask (8-bit, 0/255), the label image with <b>tracked</b> object
 * numbers (the same cell has the same number on every time point; 16-bit, 32-bit beyond 65535
 * tracks) and, with three or more classes, the class map ({@link ClassMapImages}); a Results table
 * with a {@code frame} column (1-based time point) before the columns of the objects CSV (tracked
 * numbers in {@code object}, {@code class} after it with three or more classes); and ROIs named as
 * in {@code NAME.rois.zip} ({@code object-0012-t0003}, {@code object-0012-z0004-t0003} in stacks,
 * {@code -class3} added with classes; {@code RoiExport.roisOfFrame}) with their hyperstack position
 * (any channel, their z plane, their time point), coloured by class. The images carry the source's
 * calibration (frame interval included) and their making as image info. The source is never
 * changed.
 *
 * @param mask the masks over time
 * @param labels the tracked label images over time
 * @param classes the class maps over time, or null for two classes
 * @param table one row per object and time point, time point by time point
 * @param result the segmentation shown
 * @param notes time axis decisions and warnings, for the Log
 */
record TimeLapseImages(
    ImagePlus mask,
    ImagePlus labels,
    ImagePlus classes,
    ResultsTable table,
    TimeLapseResult result,
    List<String> notes)
    implements Presentable {

  TimeLapseImages {
    notes = List.copyOf(notes);
  }

  /**
   * Builds images and table.
   *
   * @param source the image segmented (only read)
   * @param series its time points, as segmented
   * @param info the image info text for the result images
   */
  static TimeLapseImages of(
      ImagePlus source,
      OpenedSeries series,
      TimeLapseResult result,
      String info,
      List<String> notes) {
    int w = series.width();
    int h = series.height();
    int d = series.depth();
    int frames = result.frameCount();
    String base = ResultImages.baseTitle(source.getTitle());
    ImageStack maskStack = new ImageStack(w, h);
    ImageStack labelStack = new ImageStack(w, h);
    int tracks = result.nextNumber() - 1;
    boolean shorts = tracks <= 65535;
    List<byte[]> classMaps = new ArrayList<>();
    for (TimeLapseFrame f : result.frames()) {
      Segmentation s = f.segmentation();
      ImageOutputs.addBytePlanes(maskStack, s.mask(), w, h, d);
      ImageOutputs.addLabelPlanes(labelStack, f.trackedLabels(), w, h, d, shorts);
      if (s.isMultiClass()) {
        classMaps.add(s.classes().labels());
      }
    }
    ImagePlus mask = new ImagePlus(base + ".mask", maskStack);
    ImagePlus labels = new ImagePlus(base + ".labels", labelStack);
    ImagePlus classes = null;
    if (classMaps.size() == frames) {
      classes = ClassMapImages.image(base + ".classes", classMaps, w, h, d);
    }
    for (ImagePlus imp : new ImagePlus[] {mask, labels, classes}) {
      if (imp == null) {
        continue;
      }
      imp.setDimensions(1, d, frames);
      imp.setOpenAsHyperStack(frames > 1);
      imp.setCalibration(source.getCalibration().copy());
      imp.setProperty("Info", info);
    }
    mask.setDisplayRange(0, 255);
    labels.setDisplayRange(0, Math.max(1, tracks));
    return new TimeLapseImages(mask, labels, classes, table(result, series), result, notes);
  }

  /** The table: per time point, the tracked measurements with a {@code frame} column. */
  static ResultsTable table(TimeLapseResult result, OpenedSeries series) {
    ResultsTable rt = new ResultsTable();
    rt.setPrecision(6);
    boolean stack = series.depth() > 1;
    for (TimeLapseFrame f : result.frames()) {
      Segmentation s = f.segmentation();
      int[] channels = ResultImages.measuredChannels(s, series.channelCount());
      ResultImages.addRows(
          rt, f.measurements(), f.classOfTracked(), stack, s, channels, f.index() + 1);
    }
    return rt;
  }

  /** The ROIs of every time point, named and positioned as in the class comment. */
  List<Roi> rois() {
    List<Roi> out = new ArrayList<>();
    for (TimeLapseFrame f : result.frames()) {
      Segmentation s = f.segmentation();
      ClassMap cm = s.classes();
      List<Roi> rois =
          RoiExport.roisOfFrame(
              s.objects(), cm == null ? null : cm.objectClasses(), f.numberOf(), f.index());
      rois.forEach(ClassMapImages::colour);
      out.addAll(rois);
    }
    return out;
  }

  @Override
  public void show(boolean roisToManager) {
    ResultImages.showAll(
        new ImagePlus[] {mask, labels, classes}, table, roisToManager ? this::rois : null);
  }

  @Override
  public String summary() {
    int objects = 0;
    for (TimeLapseFrame f : result.frames()) {
      objects += f.objectCount();
    }
    return String.format(
        Locale.ROOT,
        "Cleave: %d time points, %d object(s) in all, %d track number(s); seeds on time point %d",
        result.frameCount(),
        objects,
        result.nextNumber() - 1,
        result.seedFrame() + 1);
  }
}
