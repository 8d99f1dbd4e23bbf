package io.github.cleave.flow;

/** Receives the flow of one arc; see {@link MaxFlowResult#visitArcFlows(ArcFlowVisitor)}. */
@FunctionalInterface
public interface ArcFlowVisitor {
  /**
   * One arc and its flow.
   *
   * @param from tail node, in the solver's node numbering
   * @param to head node, in the solver's node numbering
   * @param flow flow on the arc, {@code 0 < flow <= capacity}
   */
  void arc(int from, int to, long flow);
}
