package io.github.cleave.flow;

/**
 * Something that accepts the arcs of a max-flow problem one at a time, such as a solver being built
 * from a file. Node identifiers are those of the problem's own numbering (for a DIMACS file, the
 * numbers in the file).
 */
public interface FlowArcSink {
  /**
   * Adds an arc. Parallel arcs may be kept apart or merged, at the implementation's choice.
   *
   * @param from tail node
   * @param to head node
   * @param capacity {@code 0 <= capacity <= Integer.MAX_VALUE}
   * @throws IllegalArgumentException naming the offending value and what is accepted, when the arc
   *     cannot be represented (unknown node, negative or too large capacity, not a grid neighbour)
   */
  void addArc(int from, int to, long capacity);
}
