package io.github.cleave.flow;

/**
 * Fills a {@link GridMaxFlow} from arcs numbered as in a grid-structured DIMACS file: ids {@code 1
 * .. W*H*D} are the pixels in row-major order (x fastest), so pixel node {@code id - 1}; two
 * further ids name the source and the sink.
 *
 * <ul>
 *   <li>source → pixel and pixel → sink arcs add to the pixel's terminal capacities;
 *   <li>pixel → pixel arcs must join neighbours of the grid's neighbourhood and add to that arc;
 *   <li>source → sink arcs add to the direct source–sink capacity;
 *   <li>arcs into the source, out of the sink, and loops carry no flow in a maximum flow and are
 *       ignored.
 * </ul>
 *
 * Parallel arcs are merged. Errors are {@link IllegalArgumentException}s naming both ids.
 */
public final class GridArcSink implements FlowArcSink {
  private final GridMaxFlow grid;
  private final int sourceId;
  private final int sinkId;
  private final int pixels;

  /**
   * @throws IllegalArgumentException if a terminal id is a pixel id or the two are equal
   */
  public GridArcSink(GridMaxFlow grid, int sourceId, int sinkId) {
    this.grid = grid;
    this.sourceId = sourceId;
    this.sinkId = sinkId;
    this.pixels = grid.nodeCount();
    if (sourceId == sinkId) {
      throw new IllegalArgumentException("source and sink are both node " + sourceId);
    }
    for (int id : new int[] {sourceId, sinkId}) {
      if (id >= 1 && id <= pixels) {
        throw new IllegalArgumentException(
            "terminal node "
                + id
                + " is a pixel of the "
                + grid.width()
                + "x"
                + grid.height()
                + "x"
                + grid.depth()
                + " grid; terminals must be numbered outside 1.."
                + pixels);
      }
    }
  }

  @Override
  public void addArc(int from, int to, long capacity) {
    if (from == to || to == sourceId || from == sinkId) {
      return;
    }
    if (from == sourceId) {
      if (to == sinkId) {
        grid.addSourceSinkCapacity(capacity);
      } else {
        grid.addTerminalCapacities(pixel(to), capacity, 0);
      }
      return;
    }
    int tail = pixel(from);
    if (to == sinkId) {
      grid.addTerminalCapacities(tail, 0, capacity);
      return;
    }
    int head = pixel(to);
    int k = grid.directionTo(tail, head);
    if (k < 0) {
      throw new IllegalArgumentException(
          "node "
              + from
              + " and node "
              + to
              + " are not "
              + grid.neighborhood()
              + "-neighbours in the "
              + grid.width()
              + "x"
              + grid.height()
              + "x"
              + grid.depth()
              + " grid");
    }
    grid.addNeighborCapacity(tail, k, capacity);
  }

  private int pixel(int id) {
    if (id < 1 || id > pixels) {
      throw new IllegalArgumentException(
          "node " + id + " is neither a terminal nor a pixel (pixels are 1.." + pixels + ")");
    }
    return id - 1;
  }
}
