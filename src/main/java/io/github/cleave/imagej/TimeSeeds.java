package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.ImageStack;
import ij.WindowManager;
import ij.gui.Roi;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.OpenedSeries;
import java.util.Locale;
import java.util.TreeSet;

/**
 * The seeds of a time-lapse and the time point they were drawn on (0-based {@link #frame}), from
 * the choices of {@link SeedSource}:
 *
 * <ul>
 *   <li><b>ROIs</b> (the ROI Manager): each ROI's time point is its T position (ImageJ's {@code
 *       Roi.getTPosition()}), or, for a ROI with a plain stack position, the frame of that stack
 *       plane ({@code ImagePlus.convertIndexToPosition}); when the slices are read as time points,
 *       the slice is the time point. Every ROI that has a time point must have the same one; ROIs
 *       without one belong to the fallback time point. Within the time point a ROI marks its z
 *       plane, as in a seed ROI zip.
 *   <li><b>A seed label image</b> of one time point (the image's width, height and z planes)
 *       belongs to the fallback time point; one with the image's time points (frames, or slices
 *       when slices are time points) belongs to the one time point that holds seeds (it must be
 *       exactly one).
 *   <li><b>None</b>: no seeds, the fallback time point (where a saved model starts).
 * </ul>
 *
 * The fallback time point is {@link TimeSettings#seedFrame()} when it is set, else the image's
 * current one (as the brush and the overlay draw on it). Stateless.
 *
 * @param seeds the seeds of one time point (w × h × z planes), or null for none
 * @param frame the time point they belong to, 0-based
 * @param from one line saying where seeds and time point came from, for the image info
 */
record TimeSeeds(SeedLabels seeds, int frame, String from) {

  /**
   * The seeds named by {@code choice} for the time-lapse {@code series} of {@code imp}.
   *
   * @throws BadInputException if the seeds cannot serve (wrong size, several time points, a time
   *     point the image does not have)
   */
  static TimeSeeds read(String choice, ImagePlus imp, OpenedSeries series, TimeSettings time) {
    int fallback = fallbackFrame(imp, series, time);
    if (choice == null || choice.isBlank() || choice.equalsIgnoreCase(SeedSource.NONE)) {
      return new TimeSeeds(null, fallback, "no seeds; starts on time point " + (fallback + 1));
    }
    if (choice.equals(SeedSource.ROI_MANAGER)) {
      return fromRois(SeedSource.managerRois(), imp, series, fallback);
    }
    ImagePlus seeds = WindowManager.getImage(choice);
    if (seeds == null) {
      throw new BadInputException(
          "seeds="
              + choice
              + ": no open image has this title; open the seed label image, or use seeds=["
              + SeedSource.ROI_MANAGER
              + "]");
    }
    return fromImage(seeds, series, fallback);
  }

  /** The fallback time point, 0-based (see the class comment). */
  static int fallbackFrame(ImagePlus imp, OpenedSeries series, TimeSettings time) {
    int frames = series.frameCount();
    if (time.seedFrame() > 0) {
      if (time.seedFrame() > frames) {
        throw new BadInputException(
            String.format(
                Locale.ROOT,
                "seed_frame=%d: %s has time points 1..%d",
                time.seedFrame(),
                series.title(),
                frames));
      }
      return time.seedFrame() - 1;
    }
    int[] czt = imp.convertIndexToPosition(imp.getCurrentSlice());
    int t = series.timeSource() == OpenedSeries.TimeSource.SLICES_AS_FRAMES ? czt[1] : czt[2];
    return Math.min(frames, Math.max(1, t)) - 1;
  }

  /** Seeds from ROIs, see the class comment. */
  static TimeSeeds fromRois(Roi[] rois, ImagePlus imp, OpenedSeries series, int fallback) {
    boolean slicesAreTime = series.timeSource() == OpenedSeries.TimeSource.SLICES_AS_FRAMES;
    int depth = series.depth();
    TreeSet<Integer> frames = new TreeSet<>();
    Roi[] planar = new Roi[rois.length];
    for (int i = 0; i < rois.length; i++) {
      Roi roi = rois[i];
      int z;
      int t;
      if (roi.hasHyperStackPosition()) {
        z = roi.getZPosition();
        t = roi.getTPosition();
      } else if (roi.getPosition() > 0) {
        int[] czt = imp.convertIndexToPosition(roi.getPosition());
        z = czt[1];
        t = czt[2];
      } else {
        z = 0;
        t = 0;
      }
      if (slicesAreTime) {
        t = z > 0 ? z : t; // ImageJ sees the time points as slices
        z = 0;
      }
      if (t > 0) {
        frames.add(t);
      }
      Roi copy = (Roi) roi.clone();
      copy.setPosition(0, depth > 1 ? z : 0, 0);
      planar[i] = copy;
    }
    if (frames.size() > 1) {
      throw new BadInputException(
          "the seed ROIs lie on time points "
              + frames
              + "; put every seed ROI on one time point (the model is learned there), or leave"
              + " their time position unset and give seed_frame");
    }
    int frame = frames.isEmpty() ? fallback : frames.first() - 1;
    if (frame >= series.frameCount()) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "the seed ROIs lie on time point %d, but %s has time points 1..%d",
              frame + 1,
              series.title(),
              series.frameCount()));
    }
    SeedLabels seeds = SeedSource.fromRois(planar, series.width(), series.height(), depth);
    String from =
        frames.isEmpty()
            ? "ROI Manager, no time position: time point " + (frame + 1)
            : "ROI Manager, on time point " + (frame + 1);
    return new TimeSeeds(seeds, frame, from);
  }

  /** Seeds from a seed label image, see the class comment. */
  static TimeSeeds fromImage(ImagePlus seeds, OpenedSeries series, int fallback) {
    int w = series.width();
    int h = series.height();
    int d = series.depth();
    int frames = series.frameCount();
    String title = seeds.getTitle();
    if (seeds.getStackSize() != d * frames
        || seeds.getNChannels() != 1
        || seeds.getWidth() != w
        || seeds.getHeight() != h
        || frames == 1) {
      SeedLabels one = SeedSource.fromImage(seeds, w, h, d);
      return new TimeSeeds(
          one,
          fallback,
          "seed image " + title + " of one time point: time point " + (fallback + 1));
    }
    ImageStack stack = seeds.getStack();
    int found = -1;
    for (int t = 0; t < frames; t++) {
      if (holdsSeeds(stack, t * d, d)) {
        if (found >= 0) {
          throw new BadInputException(
              String.format(
                  Locale.ROOT,
                  "seed image %s holds seeds on time points %d and %d; seeds belong on one time"
                      + " point (the model is learned there)",
                  title,
                  found + 1,
                  t + 1));
        }
        found = t;
      }
    }
    if (found < 0) {
      throw new BadInputException("seed image " + title + " holds no seed on any time point");
    }
    ImageStack one = new ImageStack(w, h);
    for (int z = 0; z < d; z++) {
      one.addSlice(null, stack.getProcessor(found * d + z + 1));
    }
    ImagePlus frame = new ImagePlus(title, one);
    return new TimeSeeds(
        SeedSource.fromImage(frame, w, h, d),
        found,
        "seed image " + title + ", seeds on time point " + (found + 1));
  }

  private static boolean holdsSeeds(ImageStack stack, int first, int planes) {
    for (int z = 0; z < planes; z++) {
      Object p = stack.getPixels(first + z + 1);
      if (p instanceof byte[] b) {
        for (byte v : b) {
          if (v != 0) {
            return true;
          }
        }
      } else if (p instanceof short[] s) {
        for (short v : s) {
          if (v != 0) {
            return true;
          }
        }
      } else {
        return true; // other types are refused by SeedSource.fromImage with their own message
      }
    }
    return false;
  }
}
