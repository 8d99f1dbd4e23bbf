package io.github.cleave.flow;

import java.util.BitSet;

/**
 * A solver's answer to a {@link FlowProblem}, in terms the tests can check without trusting the
 * solver: the network as the solver holds it (the grid solver merges parallel arcs), the flow on
 * each of its arcs, and the solver's source side in the problem's node numbering.
 */
record SolvedProblem(MaxFlowResult result, FlowProblem network, long[] flows, BitSet sourceSide) {}
