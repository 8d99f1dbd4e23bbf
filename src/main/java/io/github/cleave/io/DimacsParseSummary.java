package io.github.cleave.io;

/**
 * What reading a DIMACS file found and how long it took.
 *
 * @param header the problem and terminal lines
 * @param arcsRead number of {@code a} lines (equal to {@code header.arcs()} after a successful
 *     read)
 * @param lines number of lines read
 * @param nanos wall-clock time of the read, including the time the arc sink took
 */
public record DimacsParseSummary(DimacsHeader header, long arcsRead, long lines, long nanos) {}
