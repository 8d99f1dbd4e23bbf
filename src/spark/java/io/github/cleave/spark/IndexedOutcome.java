package io.github.cleave.spark;

import io.github.cleave.batch.FileOutcome;
import java.io.Serializable;

/** A file's outcome with its place in the run order, sent from a task to the driver. */
record IndexedOutcome(int index, FileOutcome outcome) implements Serializable {}
