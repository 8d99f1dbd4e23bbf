package io.github.cleave.io;

/**
 * The problem line and terminal lines of a DIMACS max-flow file, in the file's own 1-based ids.
 *
 * @param nodes node count of the {@code p max NODES ARCS} line
 * @param arcs arc count of the problem line
 * @param source id of the {@code n ID s} line
 * @param sink id of the {@code n ID t} line
 */
public record DimacsHeader(int nodes, long arcs, int source, int sink) {}
