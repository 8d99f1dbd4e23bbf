package io.github.cleave.cli;

import io.github.cleave.image.BadInputException;
import java.io.PrintWriter;
import java.util.concurrent.CancellationException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * The {@code cleave} command line: subcommands for solving and generating max-flow problems (and,
 * as they arrive, for segmenting images). Errors in the arguments or the input are reported as one
 * line on standard error with exit code 2; see {@link ExitCodes}.
 */
@Command(
    name = "cleave",
    mixinStandardHelpOptions = true,
    versionProvider = CleaveCommand.Version.class,
    description = {
      "Seeded minimum-cut segmentation of microscope images, and its max-flow engine.",
      "Start with 'demo' (segments the bundled samples), then 'segment', 'learn' and 'apply'.",
      "Research tool, not a diagnostic device: validate segmentations against expert"
          + " annotation; local rules and licensed practice govern any clinical use."
    },
    subcommands = {
      SegmentCommand.class,
      LearnCommand.class,
      ApplyCommand.class,
      BatchCommand.class,
      DemoCommand.class,
      MakeSamplesCommand.class,
      MaxflowCommand.class,
      MakeMaxflowCommand.class,
      CommandLine.HelpCommand.class
    })
public final class CleaveCommand implements Runnable {

  /** Runs the command line and exits with its exit code. */
  public static void main(String[] args) {
    System.exit(newCommandLine().execute(args));
  }

  /** A configured command line; tests call {@code execute} on it with their own writers. */
  public static CommandLine newCommandLine() {
    return withErrorHandling(new CommandLine(new CleaveCommand()));
  }

  /**
   * Gives {@code cl} the error handling of this command line: bad arguments and {@code
   * BadInputException} as one line on standard error with exit code 2, an I/O error likewise,
   * cancellation with 130; anything else is rethrown.
   *
   * @return {@code cl}
   */
  public static CommandLine withErrorHandling(CommandLine cl) {
    cl.setParameterExceptionHandler(
        (ex, args) -> {
          PrintWriter err = ex.getCommandLine().getErr();
          err.println(
              "cleave: "
                  + ex.getMessage()
                  + " (see '"
                  + ex.getCommandLine().getCommandSpec().qualifiedName()
                  + " --help')");
          return ExitCodes.BAD_INPUT;
        });
    cl.setExecutionExceptionHandler(
        (ex, commandLine, parseResult) -> {
          if (ex instanceof InputException || ex instanceof BadInputException) {
            commandLine.getErr().println("cleave: " + ex.getMessage());
            return ExitCodes.BAD_INPUT;
          }
          if (ex instanceof java.io.IOException) {
            commandLine
                .getErr()
                .println(
                    "cleave: cannot read or write a file: "
                        + ex
                        + " (check that the folder exists and is writable, and the disk has room)");
            return ExitCodes.BAD_INPUT;
          }
          if (ex instanceof CancellationException) {
            commandLine.getErr().println("cleave: interrupted; no partial file was left");
            return ExitCodes.INTERRUPTED;
          }
          throw ex;
        });
    return cl;
  }

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(spec.commandLine(), "a command is missing");
  }

  /** The version from the jar manifest, or "development" when run from classes. */
  static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      String v = CleaveCommand.class.getPackage().getImplementationVersion();
      return new String[] {"cleave " + (v == null ? "development" : v)};
    }
  }
}
