package io.github.cleave.segment;

/** The version of Cleave that is running: from the jar manifest, or "development". */
public final class SoftwareVersion {
  private SoftwareVersion() {}

  /** The version string. */
  public static String get() {
    String v = SoftwareVersion.class.getPackage().getImplementationVersion();
    return v == null ? "development" : v;
  }
}
