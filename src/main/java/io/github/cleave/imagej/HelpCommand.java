package io.github.cleave.imagej;

import ij.IJ;
import ij.gui.HTMLDialog;
import ij.plugin.PlugIn;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * {@code Plugins > Cleave > Cleave Help}: a short page on how to use the plugin, with the
 * research-use caution (also reachable from the seed brush panel). The page is the resource {@code
 * help.html} next to this class.
 */
public final class HelpCommand implements PlugIn {
  /** Creates the command (ImageJ calls this through {@link CommandGate}). */
  public HelpCommand() {}

  @Override
  public void run(String arg) {
    show();
  }

  /** The help page's HTML. */
  static String page() {
    try (InputStream in = HelpCommand.class.getResourceAsStream("help.html")) {
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    } catch (IOException | NullPointerException e) {
      return "<html>Cleave: the help page is missing from the plugin jar.</html>";
    }
  }

  /** Shows the page in a window that does not block ImageJ (the Log without a display). */
  static void show() {
    if (Problems.unattended()) {
      IJ.log(page().replaceAll("<[^>]+>", ""));
      return;
    }
    new HTMLDialog("Cleave help", page(), false);
  }
}
