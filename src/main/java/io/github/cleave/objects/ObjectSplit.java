package io.github.cleave.objects;

/** How touching objects (one connected mask component holding several objects) are separated. */
public enum ObjectSplit {
  /** No splitting: one object per connected component of the mask. */
  NONE,
  /**
   * Split at the necks of the distance map: watershed of the Euclidean distance to the background,
   * flooded from its maxima (Vincent and Soille, IEEE TPAMI 13(6), 1991); one object per distance
   * peak that stands out by more than half a pixel (single plane: ImageJ's own EDM watershed) or
   * half the finest voxel side (stack: our calibrated 3D version). See {@link ObjectSplitting}.
   */
  DISTANCE_WATERSHED,
  /**
   * One object per separate foreground stroke: every mask voxel goes to the nearest stroke of its
   * mask component; components no stroke touches stay objects of their own.
   */
  PER_STROKE
}
