package io.github.cleave.objects;

/** How touching objects (one connected mask component holding several objects) are separated. */
public enum ObjectSplit {
  /** No splitting: one object per connected component of the mask. */
  NONE,
  /**
   * Split at the necks of the distance map: watershed of the Euclidean distance to the background
   * from its maxima (see {@link DistanceWatershed}); one object per distance peak that stands out
   * by more than half a pixel or voxel.
   */
  DISTANCE_WATERSHED,
  /**
   * One object per separate foreground stroke: every mask voxel goes to the nearest stroke of its
   * mask component; components no stroke touches stay objects of their own.
   */
  PER_STROKE
}
