package io.github.cleave.imagej;

import ij.CommandListener;
import ij.ImagePlus;
import ij.WindowManager;
import java.awt.EventQueue;
import java.util.function.BooleanSupplier;

/**
 * Routes ImageJ's {@code Edit > Undo} (and its shortcut Ctrl+Z on an image window) to the seed
 * brush: when the current image is being painted and the seed brush is the selected tool, the
 * command undoes the last change of the strokes ({@link BrushSession#undo()}, which redraws the
 * strokes before it and cuts again) and ImageJ's own Undo does not run, so it cannot touch the
 * image. Any other command, image or tool passes through unchanged.
 *
 * <p>Why not ImageJ's own overlay undo ({@code Undo.setup(Undo.OVERLAY, imp)}): it keeps one copy
 * of the overlay and puts it back without telling the session, whose next redraw would bring the
 * undone stroke back; the strokes, not the overlay, are the state to restore.
 *
 * <p>Registered with {@link ij.Executer#addCommandListener} while any image is painted; ImageJ
 * calls it on its command thread, so the undo itself is handed to the event thread.
 */
final class BrushUndo implements CommandListener {
  /** ImageJ's name of the Edit &gt; Undo command. */
  static final String UNDO = "Undo";

  private final SeedBrushTool tool;
  private final BooleanSupplier brushSelected;

  BrushUndo(SeedBrushTool tool, BooleanSupplier brushSelected) {
    this.tool = tool;
    this.brushSelected = brushSelected;
  }

  /** The session that Undo on {@code current} goes to, or null if ImageJ's Undo should run. */
  BrushSession routeTo(String command, ImagePlus current) {
    if (!UNDO.equals(command) || current == null || !brushSelected.getAsBoolean()) {
      return null;
    }
    return tool.session(current);
  }

  @Override
  public String commandExecuting(String command) {
    BrushSession session = routeTo(command, WindowManager.getCurrentImage());
    if (session == null) {
      return command;
    }
    EventQueue.invokeLater(session::undo);
    return null; // handled: ImageJ's Undo does not run
  }
}
