package io.github.cleave.imagej;

import ij.IJ;
import ij.plugin.PlugIn;

/**
 * The entry point of every Cleave menu command: checks the running Java version first, then starts
 * the command named by the argument of its {@code plugins.config} line.
 *
 * <p>This class alone is compiled for Java 8 (class file version 52), so that an ImageJ running on
 * an older Java can load it and explain that Cleave needs Java 17 or newer, instead of failing with
 * an {@code UnsupportedClassVersionError} when it loads one of the Java 17 classes. The command
 * class is loaded by name only after the check passes. It must use nothing newer than Java 8.
 *
 * <p>The argument is the simple name of a class in this package that implements {@link PlugIn}
 * (for example {@code SegmentImageCommand}); that class's {@code run("")} is called on the same
 * thread, so macro options reach it unchanged.
 */
public final class CommandGate implements PlugIn {
  /** The oldest Java feature release Cleave runs on. */
  public static final int REQUIRED_JAVA = 17;

  /** Starts the command named by {@code arg} when the Java version allows it. */
  @Override
  public void run(String arg) {
    String problem = problem(System.getProperty("java.specification.version"));
    if (problem != null) {
      report(problem);
      return;
    }
    String className = CommandGate.class.getPackage().getName() + "." + arg.trim();
    PlugIn command;
    try {
      command = (PlugIn) Class.forName(className).getDeclaredConstructor().newInstance();
    } catch (ReflectiveOperationException | LinkageError | ClassCastException e) {
      report("Cleave cannot start its command '" + arg + "': " + e);
      return;
    }
    command.run("");
  }

  /**
   * The message that explains why Cleave cannot run on the Java of the given specification version
   * ({@code "1.8"} style before Java 9, {@code "17"} after), or {@code null} when it can. An
   * unreadable version is let through: the command itself then runs or fails.
   */
  public static String problem(String specificationVersion) {
    int feature = featureRelease(specificationVersion);
    if (feature < 0 || feature >= REQUIRED_JAVA) {
      return null;
    }
    return "Cleave needs Java "
        + REQUIRED_JAVA
        + " or newer; this ImageJ runs Java "
        + feature
        + ". Install an ImageJ bundled with Java "
        + REQUIRED_JAVA
        + " or newer (or start ImageJ with such a Java) and run the command again.";
  }

  /**
   * The feature release of a Java specification version: {@code "1.8"} → 8, {@code "17"} → 17,
   * {@code "21.0.2"} → 21; -1 when it cannot be read.
   */
  static int featureRelease(String specificationVersion) {
    if (specificationVersion == null) {
      return -1;
    }
    String v = specificationVersion.trim();
    if (v.startsWith("1.")) {
      v = v.substring(2);
    }
    int end = 0;
    while (end < v.length() && Character.isDigit(v.charAt(end))) {
      end++;
    }
    if (end == 0 || end > 4) {
      return -1;
    }
    return Integer.parseInt(v.substring(0, end));
  }

  /** Tells the user: a log line in a macro (never a dialog that could hang it), else a message. */
  private static void report(String message) {
    if (ij.Macro.getOptions() != null
        || ij.macro.Interpreter.isBatchMode()
        || java.awt.GraphicsEnvironment.isHeadless()) {
      IJ.log(message);
      ij.macro.Interpreter.abort();
    } else {
      IJ.error("Cleave", message);
    }
  }
}
