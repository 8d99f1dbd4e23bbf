package io.github.cleave.segment;

import java.util.Arrays;

/**
 * The zones of {@link EdgeRefinement} around a cut, from the steps of {@link BoundaryBand#steps}:
 * the band re-decided, the gap beyond it, the background ring beyond the gap and the interior, one
 * byte per voxel, with the band's voxels and the corridor's (the band and the background of the
 * gap) listed in raster order.
 *
 * <p>A voxel is in the band when it lies within {@link EdgeRefinement#BAND} steps of the boundary
 * in its plane, or within the band's reach along z of such a voxel; likewise for the gap ({@code
 * BAND + GAP} steps) and the outer limit of the ring ({@code BAND + GAP + RING}), each with its own
 * reach along z. Then, in this order: a band voxel is {@link #BAND}; a foreground voxel {@link
 * #INSIDE}; a background voxel of the gap {@link #GAP}; one within the outer limit {@link #RING};
 * any other {@link #NONE}.
 *
 * <p>One pass over the image when no zone reaches along z (every plane image, and stacks whose
 * planes lie far apart), plus one pass per plane in a zone's reach otherwise. Immutable.
 */
final class EdgeZones {
  static final byte NONE = 0;
  static final byte INSIDE = 1;
  static final byte RING = 2;
  static final byte BAND = 3;
  static final byte GAP = 4;

  /** The zone of every voxel. */
  final byte[] zone;

  /** The band's voxels, ascending. */
  final int[] band;

  /** The band's voxels and the gap's background voxels, ascending. */
  final int[] corridor;

  private EdgeZones(byte[] zone, int[] band, int[] corridor) {
    this.zone = zone;
    this.band = band;
    this.corridor = corridor;
  }

  /**
   * The zones of a cut.
   *
   * @param steps 1 + the steps in the plane from the boundary, 0 beyond {@code BAND + GAP + RING}
   * @param mask the cut, nonzero foreground
   * @param bandZ the band's reach along z in planes; likewise {@code gapZ} and {@code outerZ}
   */
  static EdgeZones of(
      byte[] steps, byte[] mask, int w, int h, int d, int bandZ, int gapZ, int outerZ) {
    int bandSteps = EdgeRefinement.BAND + 1;
    int gapSteps = EdgeRefinement.BAND + EdgeRefinement.GAP + 1;
    int outerSteps = EdgeRefinement.BAND + EdgeRefinement.GAP + EdgeRefinement.RING + 1;
    boolean[] inBand = bandZ > 0 ? within(steps, bandSteps, w, h, d, bandZ) : null;
    boolean[] inGap = gapZ > 0 ? within(steps, gapSteps, w, h, d, gapZ) : null;
    boolean[] inOuter = outerZ > 0 ? within(steps, outerSteps, w, h, d, outerZ) : null;
    int n = steps.length;
    byte[] zone = new byte[n];
    int[] band = new int[1024];
    int[] corridor = new int[1024];
    int bandCount = 0;
    int corridorCount = 0;
    for (int p = 0; p < n; p++) {
      int s = steps[p];
      boolean b = inBand != null ? inBand[p] : s != 0 && s <= bandSteps;
      if (b) {
        zone[p] = BAND;
        if (bandCount == band.length) {
          band = Arrays.copyOf(band, 2 * bandCount);
        }
        band[bandCount++] = p;
      } else if (mask[p] != 0) {
        zone[p] = INSIDE;
        continue;
      } else if (inGap != null ? inGap[p] : s != 0 && s <= gapSteps) {
        zone[p] = GAP;
      } else {
        if (inOuter != null ? inOuter[p] : s != 0 && s <= outerSteps) {
          zone[p] = RING;
        }
        continue;
      }
      if (corridorCount == corridor.length) {
        corridor = Arrays.copyOf(corridor, 2 * corridorCount);
      }
      corridor[corridorCount++] = p;
    }
    return new EdgeZones(
        zone, Arrays.copyOf(band, bandCount), Arrays.copyOf(corridor, corridorCount));
  }

  /**
   * The voxels with {@code 1 ≤ steps ≤ limit} (within {@code limit − 1} steps in the plane of the
   * boundary), dilated by a segment of ±{@code rz} planes.
   */
  private static boolean[] within(byte[] steps, int limit, int w, int h, int d, int rz) {
    boolean[] in = new boolean[steps.length];
    for (int p = 0; p < steps.length; p++) {
      in[p] = steps[p] != 0 && steps[p] <= limit;
    }
    return alongZ(in, w, h, d, rz);
  }

  /** {@code in} dilated by a segment of ±{@code rz} planes ({@code in} itself when rz is 0). */
  static boolean[] alongZ(boolean[] in, int w, int h, int d, int rz) {
    if (rz == 0) {
      return in;
    }
    boolean[] out = new boolean[in.length];
    int plane = w * h;
    for (int z = 0; z < d; z++) {
      int to = z * plane;
      for (int z2 = Math.max(0, z - rz); z2 <= Math.min(d - 1, z + rz); z2++) {
        int from = z2 * plane;
        for (int i = 0; i < plane; i++) {
          out[to + i] |= in[from + i];
        }
      }
    }
    return out;
  }
}
