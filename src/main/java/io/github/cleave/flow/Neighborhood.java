package io.github.cleave.flow;

/**
 * The neighbour offsets of a regular pixel or voxel grid.
 *
 * <p>Directions are numbered {@code 0 .. size()-1} and come in opposite pairs: direction {@code k}
 * and direction {@code k ^ 1} point in opposite ways, so {@link #opposite(int)} is a bit flip and
 * never a table look-up. The first directions of a larger neighbourhood are those of the smaller
 * one it extends (4 ⊂ 8 ⊂ 16 in 2D, 6 ⊂ 18 ⊂ 26 in 3D).
 *
 * <ul>
 *   <li>{@link #N4}: the four axial neighbours.
 *   <li>{@link #N8}: adds the four diagonals.
 *   <li>{@link #N16}: adds the eight "knight's move" offsets (±1, ±2) and (±2, ±1).
 *   <li>{@link #N6}: the six face neighbours of a voxel.
 *   <li>{@link #N18}: adds the twelve edge (face-diagonal) neighbours.
 *   <li>{@link #N26}: adds the eight corner neighbours.
 * </ul>
 *
 * <p>Immutable and thread-safe.
 */
public enum Neighborhood {
  /** Four axial neighbours in a plane. */
  N4(4, false, axial2d()),
  /** Axial and diagonal neighbours in a plane. */
  N8(8, false, concat(axial2d(), diagonals2d())),
  /** Axial, diagonal and knight's-move neighbours in a plane. */
  N16(16, false, concat(concat(axial2d(), diagonals2d()), knightMoves2d())),
  /** Six face neighbours of a voxel. */
  N6(6, true, faces3d()),
  /** Face and edge neighbours of a voxel. */
  N18(18, true, concat(faces3d(), edges3d())),
  /** Face, edge and corner neighbours of a voxel. */
  N26(26, true, concat(concat(faces3d(), edges3d()), corners3d()));

  private final int size;
  private final boolean threeDimensional;
  private final int[] dx;
  private final int[] dy;
  private final int[] dz;
  private final int reach;

  Neighborhood(int size, boolean threeDimensional, int[][] offsets) {
    if (offsets.length != size) {
      throw new IllegalStateException(
          name() + ": " + offsets.length + " offsets, expected " + size);
    }
    this.size = size;
    this.threeDimensional = threeDimensional;
    this.dx = new int[size];
    this.dy = new int[size];
    this.dz = new int[size];
    int r = 0;
    for (int k = 0; k < size; k++) {
      dx[k] = offsets[k][0];
      dy[k] = offsets[k][1];
      dz[k] = offsets[k][2];
      r = Math.max(r, Math.max(Math.abs(dx[k]), Math.max(Math.abs(dy[k]), Math.abs(dz[k]))));
    }
    for (int k = 0; k < size; k += 2) {
      if (dx[k] != -dx[k + 1] || dy[k] != -dy[k + 1] || dz[k] != -dz[k + 1]) {
        throw new IllegalStateException(name() + ": directions " + k + " and " + (k + 1));
      }
    }
    this.reach = r;
  }

  /**
   * The neighbourhood with the given number of neighbours for a grid of the given dimensionality.
   *
   * @param neighbours 4, 8 or 16 in 2D; 6, 18 or 26 in 3D
   * @throws IllegalArgumentException naming the accepted values when there is no such neighbourhood
   */
  public static Neighborhood of(int neighbours) {
    for (Neighborhood n : values()) {
      if (n.size == neighbours) {
        return n;
      }
    }
    throw new IllegalArgumentException(
        "no neighborhood of "
            + neighbours
            + " neighbours; use 4, 8 or 16 (2D) or 6, 18 or 26 (3D)");
  }

  /** Number of directions. */
  public int size() {
    return size;
  }

  /** True for the voxel neighbourhoods 6, 18 and 26. */
  public boolean isThreeDimensional() {
    return threeDimensional;
  }

  /** x offset of direction {@code k}. */
  public int dx(int k) {
    return dx[k];
  }

  /** y offset of direction {@code k}. */
  public int dy(int k) {
    return dy[k];
  }

  /** z offset of direction {@code k} (0 in 2D). */
  public int dz(int k) {
    return dz[k];
  }

  /** The largest absolute offset along any axis: 2 for {@link #N16}, 1 otherwise. */
  public int reach() {
    return reach;
  }

  /** The direction pointing the opposite way: {@code k ^ 1}. */
  public static int opposite(int k) {
    return k ^ 1;
  }

  /** The direction {@code k} with offset (dx, dy, dz), or -1 if the offset is not a neighbour. */
  public int directionOf(int ox, int oy, int oz) {
    for (int k = 0; k < size; k++) {
      if (dx[k] == ox && dy[k] == oy && dz[k] == oz) {
        return k;
      }
    }
    return -1;
  }

  /** Euclidean length of the offset of direction {@code k}, in grid units. */
  public double length(int k) {
    return Math.sqrt((double) dx[k] * dx[k] + (double) dy[k] * dy[k] + (double) dz[k] * dz[k]);
  }

  @Override
  public String toString() {
    return Integer.toString(size);
  }

  // Offset tables (methods, because enum constants cannot refer to static fields in their
  // constructors' arguments).

  private static int[][] axial2d() {
    return new int[][] {{1, 0, 0}, {-1, 0, 0}, {0, 1, 0}, {0, -1, 0}};
  }

  private static int[][] diagonals2d() {
    return new int[][] {{1, 1, 0}, {-1, -1, 0}, {1, -1, 0}, {-1, 1, 0}};
  }

  private static int[][] knightMoves2d() {
    return new int[][] {
      {2, 1, 0}, {-2, -1, 0}, {1, 2, 0}, {-1, -2, 0}, {-2, 1, 0}, {2, -1, 0}, {-1, 2, 0}, {1, -2, 0}
    };
  }

  private static int[][] faces3d() {
    return new int[][] {{1, 0, 0}, {-1, 0, 0}, {0, 1, 0}, {0, -1, 0}, {0, 0, 1}, {0, 0, -1}};
  }

  private static int[][] edges3d() {
    return new int[][] {
      {1, 1, 0}, {-1, -1, 0}, {1, -1, 0}, {-1, 1, 0},
      {1, 0, 1}, {-1, 0, -1}, {1, 0, -1}, {-1, 0, 1},
      {0, 1, 1}, {0, -1, -1}, {0, 1, -1}, {0, -1, 1}
    };
  }

  private static int[][] corners3d() {
    return new int[][] {
      {1, 1, 1}, {-1, -1, -1}, {1, 1, -1}, {-1, -1, 1},
      {1, -1, 1}, {-1, 1, -1}, {-1, 1, 1}, {1, -1, -1}
    };
  }

  private static int[][] concat(int[][] a, int[][] b) {
    int[][] out = new int[a.length + b.length][];
    System.arraycopy(a, 0, out, 0, a.length);
    System.arraycopy(b, 0, out, a.length, b.length);
    return out;
  }
}
