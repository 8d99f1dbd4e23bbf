package io.github.cleave.objects;

import io.github.cleave.image.BadInputException;
import java.util.Objects;

/**
 * What {@link ObjectPipeline} does after the minimum cut. Immutable value type.
 *
 * @param fillHoles fill background regions not connected to the image border ({@link HoleFilling})
 * @param split how touching objects are separated
 * @param minSize smallest object kept, as area (unit², single plane) or volume (unit³, stack) in
 *     the calibrated unit; 0 = no limit
 * @param maxSize largest object kept, same units; 0 or {@code +∞} = no limit
 * @param excludeEdges drop objects touching the left, right, top or bottom image edge
 * @param excludeEdgePlanes in a stack, also drop objects touching the first or last plane (off by
 *     default: the z range of a stack is often set to just contain the specimen, so objects on the
 *     first or last plane are usually whole)
 */
public record ObjectSettings(
    boolean fillHoles,
    ObjectSplit split,
    double minSize,
    double maxSize,
    boolean excludeEdges,
    boolean excludeEdgePlanes) {

  /** Keeps everything: no filling, no splitting, no filters. */
  public static final ObjectSettings DEFAULT =
      new ObjectSettings(false, ObjectSplit.NONE, 0, 0, false, false);

  /**
   * @throws BadInputException if a size limit is negative or not a number, or the minimum exceeds a
   *     set maximum
   */
  public ObjectSettings {
    Objects.requireNonNull(split, "split");
    if (!(minSize >= 0) || Double.isInfinite(minSize)) {
      throw new BadInputException(
          "minimum object size " + minSize + ": use a finite number >= 0 (0 = no limit)");
    }
    if (!(maxSize >= 0)) {
      throw new BadInputException(
          "maximum object size " + maxSize + ": use a number >= 0 (0 = no limit)");
    }
    if (maxSize > 0 && minSize > maxSize) {
      throw new BadInputException(
          "minimum object size "
              + minSize
              + " exceeds the maximum "
              + maxSize
              + ": lower the minimum or raise the maximum");
    }
  }

  /** Settings with edge planes kept in stacks. */
  public ObjectSettings(
      boolean fillHoles, ObjectSplit split, double minSize, double maxSize, boolean excludeEdges) {
    this(fillHoles, split, minSize, maxSize, excludeEdges, false);
  }
}
