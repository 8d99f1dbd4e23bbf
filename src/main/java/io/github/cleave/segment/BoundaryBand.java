package io.github.cleave.segment;

import io.github.cleave.image.ByteWords;
import java.util.Arrays;

/**
 * Bands around the boundary of a mask (or between the classes of a class map), for the steps that
 * treat the voxels near a cut differently ({@link RefinedCut}, {@link EdgeRefinement}): a boundary
 * voxel is one with an axial neighbour of the other class, and a band grows from the boundary
 * voxels by axial steps (city-block distance), across planes or only within them. Breadth-first, no
 * recursion; O(n · steps). Stateless.
 */
final class BoundaryBand {
  private BoundaryBand() {}

  /**
   * Clears the labels of the voxels within {@code width} steps of the mask's boundary, the boundary
   * voxels themselves counting as the first step.
   *
   * @param planes whether the planes of a stack are separate (no step or boundary across planes)
   */
  static void clear(byte[] labels, byte[] mask, int w, int h, int d, int width, boolean planes) {
    boolean[] band = grow(boundary(mask, w, h, d, planes), w, h, d, width - 1, !planes);
    for (int p = 0; p < band.length; p++) {
      if (band[p]) {
        labels[p] = 0;
      }
    }
  }

  /**
   * Voxels with an axial neighbour of another value (within its plane when {@code planes}): of the
   * other class in a mask (one value for foreground, 0 for background), of another class in a class
   * map.
   */
  static boolean[] boundary(byte[] mask, int w, int h, int d, boolean planes) {
    boolean[] out = new boolean[mask.length];
    int plane = w * h;
    for (int z = 0; z < d; z++) {
      // a missing neighbour is compared with the voxel itself, which never differs
      int below = !planes && z > 0 ? -plane : 0;
      int above = !planes && z < d - 1 ? plane : 0;
      for (int y = 0; y < h; y++) {
        int up = y > 0 ? -w : 0;
        int down = y < h - 1 ? w : 0;
        int row = w * (y + h * z);
        for (int x = 0, p = row; x < w; x++, p++) {
          out[p] = differs(mask, p, x > 0 ? -1 : 0, x < w - 1 ? 1 : 0, up, down, below, above);
        }
      }
    }
    return out;
  }

  /**
   * Steps in the plane from the boundary: for every voxel within {@code limit} axial steps (x and y
   * only) of a boundary voxel of {@link #boundary}, 1 + that number of steps (1 on the boundary
   * voxels themselves); 0 farther away. So {@code 1 ≤ steps ≤ r + 1} is the boundary grown by r
   * steps in the plane ({@link #grow} with {@code acrossPlanes} false), for every r ≤ limit at
   * once.
   *
   * <p>The number of steps is the city-block distance, which is separable: the distance along each
   * row, then the least of those distances plus the steps along y (a sweep down and one up, whole
   * rows at a time), as in the two-pass method of A. Rosenfeld and J. L. Pfaltz, "Sequential
   * operations in digital picture processing", J. ACM 13(4):471–494, 1966,
   * doi:10.1145/321356.321357. Along a row only the {@code 2 · limit + 1} voxels around each of its
   * boundary voxels can be nearer than {@code limit + 1}, so those windows are written into a row
   * of {@code limit + 1}; the boundary voxels are found eight at a time, a word of the mask
   * compared with its four shifted neighbours (and the planes above and below), voxel by voxel only
   * where the word holds one. Distances beyond {@code limit} are kept at {@code limit + 1}, so
   * bytes suffice. O(n / 8 + b · limit) along the rows for b boundary voxels, O(n) along y.
   *
   * @param limit at most 126
   */
  static byte[] steps(byte[] mask, int w, int h, int d, boolean planes, int limit) {
    int n = mask.length;
    byte far = (byte) (limit + 1);
    int plane = w * h;
    byte[] steps = new byte[n];
    int[] marks = new int[w];
    for (int z = 0; z < d; z++) {
      int first = plane * z;
      // boundary voxels as in boundary(): a missing neighbour is the voxel itself
      int below = !planes && z > 0 ? -plane : 0;
      int above = !planes && z < d - 1 ? plane : 0;
      for (int y = 0; y < h; y++) {
        int row = first + w * y;
        Arrays.fill(steps, row, row + w, far);
        int count =
            boundaryInRow(mask, row, w, y > 0 ? -w : 0, y < h - 1 ? w : 0, below, above, marks);
        for (int i = 0; i < count; i++) { // the distance along the row, within limit of each
          int b = marks[i];
          for (int x = Math.max(0, b - limit), end = Math.min(w - 1, b + limit); x <= end; x++) {
            int distance = Math.abs(x - b);
            if (distance < steps[row + x]) {
              steps[row + x] = (byte) distance;
            }
          }
        }
      }
      for (int y = 1; y < h; y++) { // along y, whole rows: down, then up
        for (int p = first + w * y, end = p + w; p < end; p++) {
          steps[p] = (byte) Math.min(steps[p], steps[p - w] + 1);
        }
      }
      for (int y = h - 2; y >= 0; y--) {
        for (int p = first + w * y, end = p + w; p < end; p++) {
          steps[p] = (byte) Math.min(steps[p], steps[p + w] + 1);
        }
      }
    }
    for (int p = 0; p < n; p++) { // distance (0 .. far) to steps (1 .. limit + 1, 0 beyond)
      int distance = steps[p];
      steps[p] = (byte) (distance < far ? distance + 1 : 0);
    }
    return steps;
  }

  /**
   * Writes the x positions of the boundary voxels of the row starting at {@code row} into {@code
   * out}, ascending, and returns their number; {@code up}, {@code down}, {@code below} and {@code
   * above} are the offsets of those neighbours (0 where missing: a voxel never differs from
   * itself).
   */
  private static int boundaryInRow(
      byte[] mask, int row, int w, int up, int down, int below, int above, int[] out) {
    int count = 0;
    int x = 0;
    while (x < w) {
      int p = row + x;
      if (x >= 1 && x + 9 <= w) { // a word whose left and right neighbours lie in the row
        long a = ByteWords.at(mask, p);
        long differ =
            (a ^ ByteWords.at(mask, p - 1))
                | (a ^ ByteWords.at(mask, p + 1))
                | (a ^ ByteWords.at(mask, p + up))
                | (a ^ ByteWords.at(mask, p + down))
                | (a ^ ByteWords.at(mask, p + below))
                | (a ^ ByteWords.at(mask, p + above));
        if (differ != 0) {
          for (int i = 0; i < 8; i++) {
            if (differs(mask, p + i, -1, 1, up, down, below, above)) {
              out[count++] = x + i;
            }
          }
        }
        x += 8;
      } else {
        if (differs(mask, p, x > 0 ? -1 : 0, x < w - 1 ? 1 : 0, up, down, below, above)) {
          out[count++] = x;
        }
        x++;
      }
    }
    return count;
  }

  /** Whether voxel p differs from a neighbour at one of the offsets (0 for a missing one). */
  private static boolean differs(
      byte[] mask, int p, int left, int right, int up, int down, int below, int above) {
    byte v = mask[p];
    return ((mask[p + left] ^ v)
            | (mask[p + right] ^ v)
            | (mask[p + up] ^ v)
            | (mask[p + down] ^ v)
            | (mask[p + below] ^ v)
            | (mask[p + above] ^ v))
        != 0;
  }

  /**
   * A copy of {@code set} grown by {@code steps} axial steps, along z too when {@code acrossPlanes}
   * (a city-block ball of radius {@code steps} around every voxel of the set).
   */
  static boolean[] grow(boolean[] set, int w, int h, int d, int steps, boolean acrossPlanes) {
    int n = set.length;
    boolean[] in = set.clone();
    int[] front = new int[n];
    int size = 0;
    for (int p = 0; p < n; p++) {
      if (in[p]) {
        front[size++] = p;
      }
    }
    int[] next = new int[n];
    int[] around = new int[6];
    for (int step = 0; step < steps && size > 0; step++) {
      int nextSize = 0;
      for (int i = 0; i < size; i++) {
        int p = front[i];
        for (int q : axialNeighbours(p, w, h, d, !acrossPlanes, around)) {
          if (q >= 0 && !in[q]) {
            in[q] = true;
            next[nextSize++] = q;
          }
        }
      }
      int[] t = front;
      front = next;
      next = t;
      size = nextSize;
    }
    return in;
  }

  /**
   * The axial neighbours of {@code p} (−x, +x, −y, +y, −z, +z; across planes only when {@code
   * planes} is false) written into {@code out}, -1 where there is none.
   */
  static int[] axialNeighbours(int p, int w, int h, int d, boolean planes, int[] out) {
    int plane = w * h;
    int row = p / w; // one division in a plane, two in a stack: this runs for every band voxel
    int x = p - row * w;
    int z = d == 1 ? 0 : row / h;
    int y = row - z * h;
    out[0] = x > 0 ? p - 1 : -1;
    out[1] = x < w - 1 ? p + 1 : -1;
    out[2] = y > 0 ? p - w : -1;
    out[3] = y < h - 1 ? p + w : -1;
    out[4] = !planes && z > 0 ? p - plane : -1;
    out[5] = !planes && z < d - 1 ? p + plane : -1;
    return out;
  }
}
