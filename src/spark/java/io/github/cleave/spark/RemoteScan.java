package io.github.cleave.spark;

import io.github.cleave.batch.InputNames;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.apache.hadoop.fs.FileStatus;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.Path;

/**
 * Lists the inputs of a folder run on a Hadoop {@link FileSystem} by the rules of the local scan
 * ({@link InputNames}): regular files the pattern takes, subfolders only when recursive and not
 * hidden, never the output folder; relative paths with {@code /} between folders, sorted as
 * strings. One {@code listStatus} call per folder searched.
 */
final class RemoteScan {
  private RemoteScan() {}

  /**
   * @param in the input folder, qualified
   * @param out the output folder, qualified (skipped if below {@code in})
   */
  static List<String> list(FileSystem fs, Path in, Path out, InputNames names, boolean recursive)
      throws IOException {
    List<String> found = new ArrayList<>();
    walk(fs, in, "", out, names, recursive, found);
    found.sort(String::compareTo);
    return found;
  }

  private static void walk(
      FileSystem fs,
      Path dir,
      String prefix,
      Path out,
      InputNames names,
      boolean recursive,
      List<String> found)
      throws IOException {
    for (FileStatus st : fs.listStatus(dir)) {
      String name = st.getPath().getName();
      String relative = prefix + name;
      if (st.isDirectory()) {
        if (recursive && InputNames.searches(name) && !fs.makeQualified(st.getPath()).equals(out)) {
          walk(fs, st.getPath(), relative + "/", out, names, recursive, found);
        }
      } else if (st.isFile() && names.takes(name, relative)) {
        found.add(relative);
      }
    }
  }
}
