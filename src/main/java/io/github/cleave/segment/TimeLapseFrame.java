package io.github.cleave.segment;

import io.github.cleave.objects.ObjectLabels;
import io.github.cleave.objects.ObjectMeasurement;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * One frame of a {@link TimeLapseResult}: its segmentation and the tracked number of each of its
 * objects.
 *
 * <p>The segmentation's own {@link Segmentation#objects() objects} keep the label image contract of
 * one image (consecutive numbers 1..n in first-voxel order) and its measurements carry those
 * numbers. The tracked numbers are the ones to write for a time-lapse: {@link #trackedLabels()} and
 * {@link #measurements()} use them, so the same cell has the same number in every frame's label
 * image and table. Tracked numbers are positive, distinct within a frame, and need not be
 * consecutive (tracks that ended leave gaps); 0 is background.
 *
 * <p>Immutable by convention: arrays are shared, do not modify them.
 *
 * @param index the frame's time point, 0-based
 * @param segmentation the frame's segmentation (object numbers of this frame alone)
 * @param numberOf {@code numberOf[k]} is the tracked number of object k of the segmentation, k =
 *     1..count ({@code numberOf[0] = 0})
 * @param measurements the segmentation's measurements with each label replaced by its tracked
 *     number, in ascending tracked number
 */
public record TimeLapseFrame(
    int index, Segmentation segmentation, int[] numberOf, List<ObjectMeasurement> measurements) {

  /**
   * @throws IllegalArgumentException if {@code numberOf} does not have one entry per object plus
   *     one
   */
  public TimeLapseFrame {
    if (numberOf.length != segmentation.objects().count() + 1) {
      throw new IllegalArgumentException(
          "frame "
              + (index + 1)
              + ": "
              + (numberOf.length - 1)
              + " tracked numbers for "
              + segmentation.objects().count()
              + " objects");
    }
    measurements = List.copyOf(measurements);
  }

  /** A frame whose measurements are the segmentation's, renumbered by {@code numberOf}. */
  static TimeLapseFrame of(int index, Segmentation segmentation, int[] numberOf) {
    List<ObjectMeasurement> renumbered = new ArrayList<>();
    for (ObjectMeasurement m : segmentation.measurements()) {
      renumbered.add(
          new ObjectMeasurement(
              numberOf[m.label()],
              m.voxelCount(),
              m.areaOrVolume(),
              m.centroidX(),
              m.centroidY(),
              m.centroidZ(),
              m.boxX(),
              m.boxY(),
              m.boxZ(),
              m.boxWidth(),
              m.boxHeight(),
              m.boxDepth(),
              m.perimeterOrSurface(),
              m.channels()));
    }
    renumbered.sort(Comparator.comparingInt(ObjectMeasurement::label));
    return new TimeLapseFrame(index, segmentation, numberOf, renumbered);
  }

  /** Number of objects in this frame. */
  public int objectCount() {
    return segmentation.objects().count();
  }

  /** The label image with tracked numbers (a new array, the frame's voxel order). */
  public int[] trackedLabels() {
    ObjectLabels objects = segmentation.objects();
    int[] out = new int[objects.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = numberOf[objects.labelAt(i)];
    }
    return out;
  }

  /** The tracked number of object {@code k} (1..count) of the segmentation. */
  public int trackedNumber(int k) {
    return numberOf[k];
  }

  /**
   * The class of each tracked number of this frame (tracked number → class 1..K), or null for a
   * two-class segmentation.
   */
  public java.util.function.IntUnaryOperator classOfTracked() {
    ClassMap classes = segmentation.classes();
    if (classes == null) {
      return null;
    }
    int largest = 0;
    for (int k = 1; k < numberOf.length; k++) {
      largest = Math.max(largest, numberOf[k]);
    }
    int[] classOf = new int[largest + 1];
    for (int k = 1; k < numberOf.length; k++) {
      classOf[numberOf[k]] = classes.classOf(k);
    }
    return number -> classOf[number];
  }
}
