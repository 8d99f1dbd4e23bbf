@echo off
rem Cleave's command-line launcher for Windows: as the shell script "cleave" next to it.
rem One image: the JVM's quick compiler alone finishes sooner; a folder run (batch) keeps the
rem optimising compiler. Extra Java options: the variable CLEAVE_JAVA_OPTIONS.
setlocal
set "CLEAVE_JAR=%~dp0cleave-${project.version}-cli.jar"
if not exist "%CLEAVE_JAR%" (
  echo cleave: %CLEAVE_JAR% is missing: build it with "mvn -DskipTests package" 1>&2
  exit /b 2
)
set "CLEAVE_COMPILER=-XX:TieredStopAtLevel=1"
if /I "%~1"=="batch" set "CLEAVE_COMPILER="
java %CLEAVE_COMPILER% %CLEAVE_JAVA_OPTIONS% -jar "%CLEAVE_JAR%" %*
exit /b %ERRORLEVEL%
