package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import ij.WindowManager;
import ij.plugin.PlugIn;
import io.github.cleave.image.BadInputException;
import java.awt.EventQueue;
import java.awt.GraphicsEnvironment;

/**
 * {@code Plugins > Cleave > Seed Brush}: selects the seed brush tool and opens its control panel
 * for the current image ({@link BrushPanel}). Needs a display; the image's pixels are never
 * changed.
 */
public final class SeedBrushCommand implements PlugIn {
  /** The menu command's name. */
  public static final String TITLE = "Seed Brush";

  /** Creates the command (ImageJ calls this through {@link CommandGate}). */
  public SeedBrushCommand() {}

  @Override
  public void run(String arg) {
    ImagePlus imp = WindowManager.getCurrentImage();
    if (imp == null) {
      Problems.report(TITLE, "no image is open; open the image to paint on first");
      return;
    }
    if (GraphicsEnvironment.isHeadless()) {
      Problems.report(TITLE, "the seed brush needs a display; use Segment Current Image in macros");
      return;
    }
    BrushSession[] session = new BrushSession[1];
    try {
      EventQueue.invokeAndWait(
          () -> {
            BrushSession open = SeedBrushTool.get().session(imp);
            if (open != null) { // one session per image: bring its panel back
              SeedBrushTool.get().run("");
              open.showPanel();
              return;
            }
            BrushPanel[] panel = new BrushPanel[1];
            session[0] = new BrushSession(imp, line -> panel[0].showStatus(line));
            panel[0] = new BrushPanel(session[0]);
            SeedBrushTool tool = SeedBrushTool.get();
            tool.attach(session[0]);
            tool.run(""); // adds the tool to the toolbar and selects it
            java.awt.Window w = imp.getWindow();
            if (w != null) {
              // beside the image; below it when the screen has no room beside it; on the screen
              java.awt.Rectangle screen = w.getGraphicsConfiguration().getBounds();
              int x = w.getX() + w.getWidth() + 8;
              int y = w.getY();
              int right = screen.x + screen.width - panel[0].getWidth();
              if (x > right) {
                x = w.getX();
                y =
                    Math.min(
                        w.getY() + w.getHeight() + 8,
                        screen.y + screen.height - panel[0].getHeight());
              }
              panel[0].setLocation(Math.max(screen.x, Math.min(x, right)), Math.max(screen.y, y));
            }
            session[0].setPanel(panel[0]);
            panel[0].setVisible(true);
          });
      IJ.showStatus("Cleave: paint foreground strokes; Alt paints background");
    } catch (BadInputException e) {
      Problems.report(TITLE, e.getMessage());
    } catch (java.lang.reflect.InvocationTargetException e) {
      Problems.report(TITLE, String.valueOf(e.getCause().getMessage()));
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
