package io.github.cleave.spark;

import java.io.Serializable;

/**
 * One input of a distributed run: its place in the run order and its path relative to the input
 * folder. Immutable, serialisable.
 */
record IndexedFile(int index, String relative) implements Serializable {}
