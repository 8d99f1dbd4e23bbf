package io.github.cleave.batch;

import io.github.cleave.image.BadInputException;
import io.github.cleave.io.SegmentationFiles;
import java.nio.file.FileSystems;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The naming rules of a folder run's inputs, shared by the local scan ({@code InputScan}) and by
 * listings of other file systems, so that every listing takes the same files in the same order.
 *
 * <p>A file is taken when its name does not start with a dot (hidden files and the {@code ._NAME}
 * resource forks some file systems add), it is not a seed file ({@code NAME.seeds.*}) or a
 * reference mask ({@code NAME.truth.*}), and the pattern matches its lower-cased name (or, for a
 * pattern with {@code /}, its lower-cased path relative to the input folder). Subfolders whose name
 * starts with a dot are not searched. Files are sorted by relative path as strings. Immutable and
 * thread-safe.
 */
public final class InputNames {
  private final String pattern;
  private final PathMatcher matcher;
  private final boolean byPath;

  private InputNames(String pattern, PathMatcher matcher) {
    this.pattern = pattern;
    this.matcher = matcher;
    this.byPath = pattern.contains("/");
  }

  /**
   * The rules for a glob pattern (see {@link BatchSettings#pattern()}).
   *
   * @throws BadInputException if the pattern is not a valid glob
   */
  public static InputNames of(String pattern) {
    try {
      return new InputNames(
          pattern,
          FileSystems.getDefault().getPathMatcher("glob:" + pattern.toLowerCase(Locale.ROOT)));
    } catch (IllegalArgumentException e) {
      throw new BadInputException(
          "the pattern '" + pattern + "' is not a valid glob (" + e.getMessage() + "); try *.tif");
    }
  }

  /**
   * Whether a regular file is an input.
   *
   * @param name its file name
   * @param relative its path relative to the input folder, {@code /} between folders
   */
  public boolean takes(String name, String relative) {
    String lower = name.toLowerCase(Locale.ROOT);
    if (lower.startsWith(".") || lower.contains(".seeds.") || lower.contains(".truth.")) {
      return false;
    }
    Path test = byPath ? Path.of(relative.toLowerCase(Locale.ROOT)) : Path.of(lower);
    return matcher.matches(test);
  }

  /** Whether a subfolder of that name is searched (with recursion on): not a hidden one. */
  public static boolean searches(String folderName) {
    return !folderName.startsWith(".");
  }

  /** The folder of the input at {@code relative} (folders joined by {@code /}); "" at the top. */
  public static String folderOf(String relative) {
    int slash = relative.lastIndexOf('/');
    return slash < 0 ? "" : relative.substring(0, slash);
  }

  /** The base name of the outputs of the input at {@code relative}: as a run names them. */
  public static String baseOf(String relative) {
    return SegmentationFiles.baseName(Path.of(relative.substring(relative.lastIndexOf('/') + 1)));
  }

  /**
   * The file beside the input at {@code relative} (or, below an output folder, its output) with
   * this suffix, e.g. {@code a/b.tif} and {@code .mask.tif} give {@code a/b.mask.tif}.
   */
  public static String sibling(String relative, String suffix) {
    String folder = folderOf(relative);
    return (folder.isEmpty() ? "" : folder + "/") + baseOf(relative) + suffix;
  }

  /**
   * Checks a listing: refuses an empty one and two inputs of one folder whose outputs would share
   * names (compared ignoring case).
   *
   * @param relatives the inputs' relative paths, {@code /} between folders
   * @param in the input folder as the user gave it, for the message
   * @throws BadInputException naming the problem and what to do
   */
  public void check(List<String> relatives, String in, boolean recursive) {
    if (relatives.isEmpty()) {
      throw new BadInputException(
          "no file matching '"
              + pattern
              + "' in "
              + in
              + (recursive ? " or its subfolders" : " (add --recursive for subfolders)")
              + "; hidden, NAME.seeds.* and NAME.truth.* files are not inputs");
    }
    Map<String, String> seen = new HashMap<>();
    for (String relative : relatives) {
      String key = (folderOf(relative) + "/" + baseOf(relative)).toLowerCase(Locale.ROOT);
      String other = seen.putIfAbsent(key, relative);
      if (other != null) {
        throw new BadInputException(
            "the inputs "
                + other
                + " and "
                + relative
                + " would write outputs of the same names ("
                + baseOf(relative)
                + ".mask.tif, ...): rename one, move it to another folder, or narrow --pattern");
      }
    }
  }
}
