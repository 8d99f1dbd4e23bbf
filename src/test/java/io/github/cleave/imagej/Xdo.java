package io.github.cleave.imagej;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/**
 * Mouse and keyboard input for the GUI tests through the {@code xdotool} program, run as an
 * external process on the display of this JVM ({@code DISPLAY} and {@code XAUTHORITY} are
 * inherited). Each call is one {@code xdotool} command chain, so its events reach the X server in
 * order; the call returns when {@code xdotool} has exited, not when the Java event thread has
 * handled the events: callers wait for the effect they expect. Coordinates are screen pixels. Every
 * failure (program missing, non-zero exit, no exit within {@value #TIMEOUT_S} s) is an {@link
 * AssertionError} that names the command and says what to do.
 */
final class Xdo {
  /** The message for a machine without the program. */
  static final String MISSING =
      "xdotool is not on the PATH: install it (apt-get install xdotool) to run the GUI tests";

  static final int TIMEOUT_S = 30;

  private Xdo() {}

  /** The {@code xdotool} executable on the {@code PATH}, if there is one. */
  static Optional<Path> find() {
    String path = System.getenv("PATH");
    if (path == null) {
      return Optional.empty();
    }
    for (String dir : path.split(File.pathSeparator)) {
      if (dir.isEmpty()) {
        continue;
      }
      Path p = Path.of(dir, "xdotool");
      if (Files.isRegularFile(p) && Files.isExecutable(p)) {
        return Optional.of(p);
      }
    }
    return Optional.empty();
  }

  /**
   * A drag with button 1 along the polyline through ({@code xs[i]}, {@code ys[i]}), with Alt held
   * from before the press to after the release when {@code alt}: the pointer moves to the first
   * point, the button goes down, the pointer moves to every further point in turn and the button
   * comes up at the last. Each move waits ({@code --sync}) until the pointer is there; a chain
   * never moves to where the pointer already is (a point equal to the one before it, or a first
   * point where the pointer rests), since {@code --sync} would then wait for ever (seen with
   * xdotool 3.20160805).
   *
   * @throws IllegalArgumentException if there is no point or the arrays differ in length
   */
  static void drag(int[] xs, int[] ys, boolean alt) {
    if (xs.length == 0 || xs.length != ys.length) {
      throw new IllegalArgumentException(
          "drag: " + xs.length + " x and " + ys.length + " y values, give as many, at least 1");
    }
    int[] at = pointer();
    List<String> a = new ArrayList<>();
    if (at[0] != xs[0] || at[1] != ys[0]) {
      a.addAll(List.of("mousemove", "--sync", "" + xs[0], "" + ys[0]));
    }
    if (alt) {
      a.addAll(List.of("keydown", "alt"));
    }
    a.addAll(List.of("mousedown", "1"));
    for (int i = 1; i < xs.length; i++) {
      if (xs[i] != xs[i - 1] || ys[i] != ys[i - 1]) {
        a.addAll(List.of("sleep", "0.02", "mousemove", "--sync", "" + xs[i], "" + ys[i]));
      }
    }
    a.addAll(List.of("sleep", "0.02", "mouseup", "1"));
    if (alt) {
      a.addAll(List.of("keyup", "alt"));
    }
    run(a);
  }

  /** The pointer's position on the screen, {x, y}. */
  static int[] pointer() {
    // --shell prints X=..., Y=..., SCREEN=..., WINDOW=... one a line
    int[] at = {-1, -1};
    for (String line : run(List.of("getmouselocation", "--shell")).split("\\R")) {
      if (line.startsWith("X=")) {
        at[0] = Integer.parseInt(line.substring(2).trim());
      } else if (line.startsWith("Y=")) {
        at[1] = Integer.parseInt(line.substring(2).trim());
      }
    }
    if (at[0] < 0 || at[1] < 0) {
      throw new AssertionError("xdotool getmouselocation --shell printed no X= and Y= lines");
    }
    return at;
  }

  /** Moves the pointer to ({@code x}, {@code y}) and clicks button 1 there. */
  static void click(int x, int y) {
    run(List.of("mousemove", "--sync", "" + x, "" + y, "click", "1"));
  }

  /** Presses and releases a key combination, e.g. {@code ctrl+z}, in the focused window. */
  static void key(String combo) {
    run(List.of("key", combo));
  }

  /** Runs {@code xdotool ARGS}, waits for it to exit 0 and returns what it printed. */
  static String run(List<String> args) {
    List<String> cmd = new ArrayList<>();
    cmd.add(find().orElseThrow(() -> new AssertionError(MISSING)).toString());
    cmd.addAll(args);
    String line = String.join(" ", cmd);
    try {
      Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
      p.getOutputStream().close();
      // xdotool prints at most a line or two, far less than a pipe holds: no reader thread needed
      if (!p.waitFor(TIMEOUT_S, TimeUnit.SECONDS)) {
        p.destroyForcibly();
        throw new AssertionError(line + " did not exit within " + TIMEOUT_S + " s");
      }
      String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).trim();
      if (p.exitValue() != 0) {
        throw new AssertionError(
            line
                + " exited "
                + p.exitValue()
                + ": "
                + out
                + " (is DISPLAY="
                + System.getenv("DISPLAY")
                + " a running X server?)");
      }
      return out;
    } catch (IOException e) {
      throw new AssertionError(line + " could not start: " + e.getMessage() + "; " + MISSING, e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new AssertionError(line + " was interrupted", e);
    }
  }
}
