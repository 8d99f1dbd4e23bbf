package io.github.cleave.imagej;

import ij.IJ;
import ij.ImageJ;
import ij.ImagePlus;
import ij.Menus;
import ij.WindowManager;
import ij.gui.GenericDialog;
import ij.plugin.frame.Recorder;
import java.awt.Button;
import java.awt.Choice;
import java.awt.Component;
import java.awt.Container;
import java.awt.Dialog;
import java.awt.EventQueue;
import java.awt.Label;
import java.awt.TextField;
import java.awt.Window;
import java.awt.event.ActionEvent;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * A real ImageJ in a child JVM, for the GUI tests: starts ImageJ with its menus (plugins from
 * {@code IJPATH/plugins}), then either runs a macro file ({@code macro IJPATH FILE ARG}) or records
 * {@code Segment Current Image...} by filling its dialog as a user would ({@code record IJPATH
 * IMAGE SEEDS OUT}: the recorder's text goes to OUT). A watchdog ends the JVM with exit code 3 as
 * soon as any unexpected dialog window shows (a macro error, an error message), so nothing can
 * hang; exit code 0 means done.
 */
public final class MacroRunner {
  private static volatile boolean expectDialog;

  private MacroRunner() {}

  public static void main(String[] args) throws Exception {
    startWatchdog();
    ImageJ.main(new String[] {"-ijpath", args[1]});
    long end = System.currentTimeMillis() + 60_000;
    while (IJ.getInstance() == null
        || Menus.getCommands() == null
        || !Menus.getCommands().containsKey("Segment Current Image...")) {
      if (System.currentTimeMillis() > end) {
        System.err.println("ImageJ did not install the Cleave commands from " + args[1]);
        Runtime.getRuntime().halt(4);
      }
      Thread.sleep(100);
    }
    if (args[0].equals("macro")) {
      String arg = args.length > 3 ? args[3] : "";
      IJ.runMacroFile(args[2], arg);
    } else {
      record(args[2], args[3], Path.of(args[4]));
    }
    Runtime.getRuntime().halt(0);
  }

  private static void record(String image, String seeds, Path out) throws Exception {
    ImagePlus seedImage = IJ.openImage(seeds);
    seedImage.show();
    ImagePlus imp = IJ.openImage(image);
    imp.show();
    IJ.wait(500);
    WindowManager.setCurrentWindow(imp.getWindow());
    Recorder recorder = new Recorder();
    Recorder.record = true;
    expectDialog = true;
    Thread command = new Thread(() -> IJ.doCommand("Segment Current Image..."));
    command.start();
    GenericDialog gd = null;
    for (int i = 0; i < 300 && gd == null; i++) {
      for (Window w : Window.getWindows()) {
        if (w instanceof GenericDialog g && g.isShowing()) {
          gd = g;
        }
      }
      Thread.sleep(100);
    }
    if (gd == null) {
      System.err.println("the dialog of Segment Current Image... did not show");
      Runtime.getRuntime().halt(5);
    }
    GenericDialog dialog = gd;
    EventQueue.invokeAndWait(
        () -> {
          ((Choice) dialog.getChoices().get(0)).select(seedImage.getTitle());
          ((TextField) dialog.getStringFields().get(0)).setText("3.5");
          Button ok = dialog.getButtons()[0];
          dialog.actionPerformed(new ActionEvent(ok, ActionEvent.ACTION_PERFORMED, "OK"));
        });
    expectDialog = false;
    for (int i = 0; i < 1200 && WindowManager.getImage("nuclei.mask") == null; i++) {
      Thread.sleep(100);
    }
    command.join(120_000);
    // ImageJ runs the command on its own thread and records it when the command returns
    for (int i = 0; i < 300 && !recorder.getText().contains("Segment Current Image"); i++) {
      Thread.sleep(100);
    }
    Files.writeString(out, recorder.getText(), StandardCharsets.UTF_8);
  }

  private static void startWatchdog() {
    Thread t =
        new Thread(
            () -> {
              while (true) {
                for (Window w : Window.getWindows()) {
                  if (w instanceof Dialog d && d.isShowing() && !expectDialog) {
                    System.err.println("dialog appeared: " + d.getTitle() + ": " + texts(d));
                    Runtime.getRuntime().halt(3);
                  }
                }
                try {
                  Thread.sleep(100);
                } catch (InterruptedException e) {
                  return;
                }
              }
            },
            "dialog watchdog");
    t.setDaemon(true);
    t.start();
  }

  private static String texts(Container c) {
    StringBuilder sb = new StringBuilder();
    for (Component k : c.getComponents()) {
      if (k instanceof Label l) {
        sb.append(l.getText()).append(' ');
      } else if (k instanceof java.awt.TextArea a) {
        sb.append(a.getText()).append(' ');
      } else if (k instanceof Container inner) {
        sb.append(texts(inner));
      }
    }
    return sb.toString().strip();
  }
}
