package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Roi;
import ij.macro.Interpreter;
import ij.measure.ResultsTable;
import ij.plugin.frame.RoiManager;
import io.github.cleave.image.Raster;
import io.github.cleave.io.ImageOutputs;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.ObjectsCsv;
import io.github.cleave.objects.ObjectLabels;
import io.github.cleave.objects.ObjectMeasurement;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.segment.ClassMap;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SoftwareVersion;
import java.awt.GraphicsEnvironment;
import java.util.List;
import java.util.Locale;

/**
 * A segmentation presented in ImageJ: a mask image (8-bit, 0/255), a label image (16-bit object
 * numbers; 32-bit beyond 65535 objects), a Results table of the objects in calibrated units (the
 * columns of {@code NAME.objects.csv}) and, with a display, the objects' ROIs in the ROI Manager.
 * The images carry the source image's calibration and, as their image info ({@code Image > Show
 * Info}, saved in TIFFs), how they were made: software version, command, inputs and every setting.
 * The source image is never changed.
 *
 * <p>Three or more classes add a class map ({@link ClassMapImages}: 8-bit class numbers 1..K in the
 * seed palette), a {@code class} column in the table right after {@code object} (as in {@code
 * NAME.objects.csv}), and ROIs in the group of their object's class, drawn in the class colour.
 *
 * @param mask the mask image
 * @param labels the label image
 * @param classes the class map, or null for two classes
 * @param table one row per object, in object-number order
 * @param segmentation what the images show
 */
record ResultImages(
    ImagePlus mask,
    ImagePlus labels,
    ImagePlus classes,
    ResultsTable table,
    Segmentation segmentation)
    implements Presentable {

  /**
   * Builds the images and the table.
   *
   * @param source the segmented image (only read)
   * @param raster its pixels as segmented
   * @param command the menu command, for the image info
   * @param inputs lines describing seeds and model, for the image info
   */
  static ResultImages of(
      ImagePlus source, Raster raster, Segmentation result, String command, List<String> inputs) {
    int w = raster.width();
    int h = raster.height();
    int d = raster.depth();
    String base = baseTitle(source.getTitle());
    String info = info(source, result, command, inputs);
    ImagePlus mask = new ImagePlus(base + ".mask", byteStack(result.mask(), w, h, d));
    ImagePlus labels = new ImagePlus(base + ".labels", labelStack(result.objects()));
    for (ImagePlus imp : new ImagePlus[] {mask, labels}) {
      imp.setDimensions(1, d, 1);
      imp.setCalibration(source.getCalibration().copy());
      imp.setProperty("Info", info);
    }
    labels.setDisplayRange(0, Math.max(1, result.objects().count()));
    ImagePlus classes = null;
    if (result.isMultiClass()) {
      classes =
          ClassMapImages.image(base + ".classes", List.of(result.classes().labels()), w, h, d);
      classes.setCalibration(source.getCalibration().copy());
      classes.setProperty("Info", info);
    }
    return new ResultImages(mask, labels, classes, table(result, raster), result);
  }

  /** The title of the table shown: ImageJ's own Results table, which macros read and save. */
  static final String TABLE = "Results";

  /**
   * Shows the images (mask, label image, class map) and the table (as ImageJ's Results table) and,
   * if asked, adds the objects' ROIs to the ROI Manager; with no display only batch-mode images are
   * kept (nothing is shown).
   */
  @Override
  public void show(boolean roisToManager) {
    showAll(new ImagePlus[] {mask, labels, classes}, table, roisToManager ? this::rois : null);
  }

  @Override
  public String summary() {
    return SegmentImageCommand.summary(segmentation);
  }

  @Override
  public List<String> notes() {
    return segmentation.warnings();
  }

  /**
   * The objects' ROIs, named and positioned as in {@code NAME.rois.zip}; with three or more classes
   * each named with its class and drawn in the class colour.
   */
  List<Roi> rois() {
    ClassMap cm = segmentation.classes();
    List<Roi> rois = RoiExport.rois(segmentation.objects(), cm == null ? null : cm.objectClasses());
    rois.forEach(ClassMapImages::colour);
    return rois;
  }

  /** Shows {@code images} (null entries skipped), {@code table} and, if given, the ROIs. */
  static void showAll(
      ImagePlus[] images, ResultsTable table, java.util.function.Supplier<List<Roi>> rois) {
    boolean headless = GraphicsEnvironment.isHeadless();
    if (!headless || Interpreter.isBatchMode()) {
      for (ImagePlus imp : images) {
        if (imp != null) {
          imp.show();
        }
      }
    }
    if (!headless) {
      table.show(TABLE);
      if (rois != null) {
        RoiManager rm = RoiManager.getRoiManager();
        for (Roi roi : rois.get()) {
          rm.addRoi(roi);
        }
      }
    }
  }

  /** The image info text of a result. */
  static String info(ImagePlus source, Segmentation result, String command, List<String> inputs) {
    StringBuilder sb = new StringBuilder();
    sb.append("Made by Cleave ").append(SoftwareVersion.get()).append('\n');
    sb.append("command: ").append(command).append('\n');
    sb.append("image: ").append(source.getTitle()).append('\n');
    for (String line : inputs) {
      sb.append(line).append('\n');
    }
    sb.append("settings: ")
        .append(ModelFiles.settingsToJson(result.model().settings()))
        .append('\n');
    sb.append(
        String.format(
            Locale.ROOT,
            "contrast scale used: %s%nflow value = cut value: %d%nenergy: %.6f nats%n",
            result.model().contrastScale(),
            result.flowValue(),
            result.energy()));
    sb.append("objects: ").append(result.objects().count()).append('\n');
    sb.append("calibration: ").append(result.voxelSize()).append('\n');
    for (String warning : result.warnings()) {
      sb.append("note: ").append(warning).append('\n');
    }
    sb.append("A research tool, not a diagnostic device: validate against expert annotation.\n");
    return sb.toString();
  }

  /** The measurements as a Results table with the columns of the objects CSV. */
  static ResultsTable table(Segmentation result, Raster raster) {
    boolean stack = raster.depth() > 1;
    int[] channels = measuredChannels(result, raster.channelCount());
    ResultsTable rt = new ResultsTable();
    rt.setPrecision(6);
    ClassMap cm = result.classes();
    addRows(rt, result.measurements(), cm == null ? null : cm::classOf, stack, result, channels, 0);
    return rt;
  }

  /** The measured channels of a result (all channels of {@code raster} when not set), 0-based. */
  static int[] measuredChannels(Segmentation result, int channelCount) {
    int[] channels = result.model().settings().measuredChannels();
    if (channels == null) {
      channels = new int[channelCount];
      for (int c = 0; c < channels.length; c++) {
        channels[c] = c;
      }
    }
    return channels;
  }

  /**
   * Adds one row per measurement with the columns of the objects CSV ({@code class} after {@code
   * object} when {@code classOf} is not null), preceded by a {@code frame} column holding {@code
   * frame} when it is above 0.
   */
  static void addRows(
      ResultsTable rt,
      List<ObjectMeasurement> measurements,
      java.util.function.IntUnaryOperator classOf,
      boolean stack,
      Segmentation result,
      int[] channels,
      int frame) {
    String[] header =
        ObjectsCsv.header(stack, result.voxelSize().unit(), channels, false, classOf != null)
            .split(",");
    for (ObjectMeasurement m : measurements) {
      int c = classOf == null ? 0 : classOf.applyAsInt(m.label());
      String[] row = ObjectsCsv.row(m, stack, null, c).split(",");
      rt.incrementCounter();
      if (frame > 0) {
        rt.addValue("frame", frame);
      }
      for (int i = 0; i < header.length; i++) {
        rt.addValue(header[i], Double.parseDouble(row[i]));
      }
    }
  }

  static String baseTitle(String title) {
    int dot = title.lastIndexOf('.');
    return dot > 0 ? title.substring(0, dot) : title;
  }

  /** A stack of byte planes holding {@code values} (w · h · d, plane after plane). */
  static ImageStack byteStack(byte[] values, int w, int h, int d) {
    ImageStack stack = new ImageStack(w, h);
    ImageOutputs.addBytePlanes(stack, values, w, h, d);
    return stack;
  }

  private static ImageStack labelStack(ObjectLabels objects) {
    ImageStack stack = new ImageStack(objects.width(), objects.height());
    ImageOutputs.addLabelPlanes(
        stack,
        objects.labels(),
        objects.width(),
        objects.height(),
        objects.depth(),
        objects.count() <= 65535);
    return stack;
  }
}
