package io.github.cleave.flow;

/**
 * Index arithmetic of a grid stored with a border of dead nodes.
 *
 * <p>The public node index of pixel (x, y, z) is {@code x + width * (y + height * z)}. Internally
 * every row starts with {@code r = reach} dead nodes (the largest neighbour offset), every plane
 * with {@code r} dead rows, and in 3D the volume has {@code r} dead planes at each end, so that
 * every neighbour of a real node is an array element and the hot loops need no bounds checks: the
 * padded index of (x, y, z) is {@code (x + r) + paddedWidth * ((y + r) + paddedHeight * (z + rz))}
 * with {@code paddedWidth = width + r} and {@code paddedHeight = height + r}, and the neighbour of
 * padded node {@code p} in direction {@code k} is {@code p + offset[k]}. A step past the end of a
 * row lands in the dead nodes that start the next row (and past the last row of a plane, in the
 * dead rows that start the next plane), so the padding between rows is shared; a short dead tail
 * covers the steps past the last row. Dead nodes have zero capacities and never join a search tree.
 */
final class GridLayout {
  final int width;
  final int height;
  final int depth;
  final Neighborhood neighborhood;
  final int directions; // K, the number of neighbour directions
  final int reach; // padding along x and y
  final int reachZ; // padding along z: reach in 3D, 0 in 2D
  final int paddedWidth;
  final int paddedHeight;
  final int paddedDepth;
  final int paddedCount; // number of padded nodes; arc arrays hold paddedCount * directions
  final int[] offset; // offset[k] = padded index difference to the neighbour in direction k

  GridLayout(int width, int height, int depth, Neighborhood neighborhood) {
    if (width < 1 || height < 1 || depth < 1) {
      throw new IllegalArgumentException(
          "grid size " + width + "x" + height + "x" + depth + ": every dimension must be >= 1");
    }
    if (!neighborhood.isThreeDimensional() && depth != 1) {
      throw new IllegalArgumentException(
          "the "
              + neighborhood
              + "-neighborhood is two-dimensional but the grid has depth "
              + depth
              + "; use depth 1, or a 6-, 18- or 26-neighborhood for volumes");
    }
    this.width = width;
    this.height = height;
    this.depth = depth;
    this.neighborhood = neighborhood;
    this.directions = neighborhood.size();
    this.reach = neighborhood.reach();
    this.reachZ = neighborhood.isThreeDimensional() ? reach : 0;
    this.paddedWidth = width + reach;
    this.paddedHeight = height + reach;
    this.paddedDepth = depth + 2 * reachZ;
    long padded =
        (long) paddedWidth * paddedHeight * paddedDepth + (long) paddedWidth * reach + reach;
    long arcs = padded * directions;
    if (arcs > Integer.MAX_VALUE - 16) {
      throw new IllegalArgumentException(
          "grid "
              + width
              + "x"
              + height
              + "x"
              + depth
              + " with a "
              + neighborhood
              + "-neighborhood needs "
              + arcs
              + " arcs, more than one Java array holds ("
              + (Integer.MAX_VALUE - 16)
              + "); split the image into tiles or use a smaller neighborhood");
    }
    this.paddedCount = (int) padded;
    this.offset = new int[directions];
    for (int k = 0; k < directions; k++) {
      offset[k] =
          neighborhood.dx(k)
              + paddedWidth * (neighborhood.dy(k) + paddedHeight * neighborhood.dz(k));
    }
  }

  /** Number of real (unpadded) nodes. */
  int nodeCount() {
    return width * height * depth;
  }

  /** Padded index of public node {@code node}; the caller has checked the range. */
  int padded(int node) {
    int x = node % width;
    int rest = node / width;
    int y = rest % height;
    int z = rest / height;
    return padded(x, y, z);
  }

  /** Padded index of pixel (x, y, z). */
  int padded(int x, int y, int z) {
    return (x + reach) + paddedWidth * ((y + reach) + paddedHeight * (z + reachZ));
  }

  /** Public node index of a padded index that lies inside the grid. */
  int unpadded(int p) {
    int x = p % paddedWidth - reach;
    int rest = p / paddedWidth;
    int y = rest % paddedHeight - reach;
    int z = rest / paddedHeight - reachZ;
    return x + width * (y + height * z);
  }

  /** True if padded index {@code p} is a real node, not part of the border. */
  boolean isInside(int p) {
    int x = p % paddedWidth - reach;
    int rest = p / paddedWidth;
    int y = rest % paddedHeight - reach;
    int z = rest / paddedHeight - reachZ;
    return x >= 0 && x < width && y >= 0 && y < height && z >= 0 && z < depth;
  }

  /** Public index of the neighbour of {@code node} in direction {@code k}, or -1 outside. */
  int neighbor(int node, int k) {
    int x = node % width + neighborhood.dx(k);
    int rest = node / width;
    int y = rest % height + neighborhood.dy(k);
    int z = rest / height + neighborhood.dz(k);
    if (x < 0 || x >= width || y < 0 || y >= height || z < 0 || z >= depth) {
      return -1;
    }
    return x + width * (y + height * z);
  }

  /** The direction from {@code from} to {@code to}, or -1 if they are not neighbours. */
  int directionTo(int from, int to) {
    int fx = from % width;
    int fr = from / width;
    int tx = to % width;
    int tr = to / width;
    return neighborhood.directionOf(tx - fx, tr % height - fr % height, tr / height - fr / height);
  }

  /** Throws unless {@code node} is a public node index. */
  void checkNode(int node) {
    if (node < 0 || node >= nodeCount()) {
      throw new IllegalArgumentException(
          "node " + node + " is outside the grid; nodes are 0.." + (nodeCount() - 1));
    }
  }

  /** Throws unless {@code k} is a direction of the neighbourhood. */
  void checkDirection(int k) {
    if (k < 0 || k >= directions) {
      throw new IllegalArgumentException(
          "direction "
              + k
              + " does not exist in the "
              + neighborhood
              + "-neighborhood; directions are 0.."
              + (directions - 1));
    }
  }
}
