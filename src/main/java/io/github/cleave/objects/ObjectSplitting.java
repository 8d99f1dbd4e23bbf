package io.github.cleave.objects;

import io.github.cleave.image.VoxelSize;

/**
 * Turns a binary mask into objects, separating touching ones by the chosen {@link ObjectSplit}.
 * Every foreground voxel belongs to exactly one object and every object is connected (8-connected
 * in a plane, 26-connected in a stack); background stays 0. Stateless and thread-safe.
 *
 * <ul>
 *   <li>{@link ObjectSplit#NONE}: {@link ConnectedComponents}.
 *   <li>{@link ObjectSplit#DISTANCE_WATERSHED}: watershed of the Euclidean distance map (L. Vincent
 *       and P. Soille, "Watersheds in digital spaces", IEEE TPAMI 13(6):583–598, 1991). Single
 *       plane: ImageJ's {@code EDM.toWatershed} (distance in pixels, maxima tolerance 0.5,
 *       independent of the black-background preference); its one-pixel dividing lines are given
 *       back to the nearest neighbouring object, so no pixel is lost. Stack: exact calibrated
 *       distance (Felzenszwalb and Huttenlocher, Theory of Computing 8, 2012), markers = maxima of
 *       the h-maxima transform with h = half the finest voxel side, then a priority-queue flood in
 *       decreasing distance (FIFO among equal distances) in which each voxel joins the first
 *       labelled neighbour that reaches it, so dividing surfaces go to one side. O(N) to find the
 *       foreground and write the labels, O(F log F) for F foreground voxels.
 *   <li>{@link ObjectSplit#PER_STROKE}: the stroke voxels inside the mask are grouped into
 *       connected pieces (same connectivity), each piece seeds one object, and every mask voxel is
 *       given to the nearest piece in its own mask component by a multi-source breadth-first search
 *       inside the mask (nearest in chessboard steps; ties to the piece reached first, in row-major
 *       order of the pieces' voxels). Mask components no stroke touches stay objects of their own.
 *       O(N).
 * </ul>
 */
public final class ObjectSplitting {
  private ObjectSplitting() {}

  /**
   * @param mask {@code w·h·d} values, row-major, nonzero = foreground
   * @param voxelSize calibration (used by the 3D distance watershed)
   * @param strokes foreground stroke voxels (nonzero), same layout as the mask; required for {@link
   *     ObjectSplit#PER_STROKE}, ignored otherwise (may be null)
   * @throws IllegalArgumentException if an array does not match the dimensions, or strokes are
   *     missing for {@code PER_STROKE}
   */
  public static ObjectLabels split(
      byte[] mask, int w, int h, int d, VoxelSize voxelSize, ObjectSplit method, byte[] strokes) {
    Grids.check(mask.length, w, h, d, "mask");
    return switch (method) { // the first two number their objects in first-voxel order
      case NONE -> ordered(w, h, d, ConnectedComponents.label(mask, w, h, d, null, 0));
      case DISTANCE_WATERSHED ->
          DistanceWatershed.split(mask, w, h, d, voxelSize.x(), voxelSize.y(), voxelSize.z());
      case PER_STROKE -> ObjectLabels.adopt(w, h, d, perStroke(mask, w, h, d, strokes));
    };
  }

  private static ObjectLabels ordered(int w, int h, int d, int[] labels) {
    int count = 0;
    for (int l : labels) {
      count = Math.max(count, l);
    }
    return ObjectLabels.ordered(w, h, d, labels, count);
  }

  private static int[] perStroke(byte[] mask, int w, int h, int d, byte[] strokes) {
    if (strokes == null) {
      throw new IllegalArgumentException(
          "splitting per stroke needs the foreground strokes; pass them or choose another split");
    }
    Grids.check(strokes.length, w, h, d, "strokes");
    byte[] inside = new byte[mask.length];
    for (int i = 0; i < inside.length; i++) {
      if (strokes[i] != 0 && mask[i] != 0) {
        inside[i] = 1;
      }
    }
    int[] pieces = ConnectedComponents.label(inside, w, h, d, null, 0);
    return SeededGrowth.grow(mask, w, h, d, pieces);
  }
}
