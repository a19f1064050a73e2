@echo off
rem polebench launcher for Windows (issue 15): the same choices as bin/polebench, which explains
rem them. Runs target\polebench.jar with the class-data archive target\polebench.jsa when it is
rem there; the quick compiler (C1) and the serial collector for ordinary runs, the full tiered JIT
rem for a batch, a lot, a folder, an input file of 8 MB or more or a stage file over 4 KB.
rem   POLEBENCH_JIT=quick or full overrides; POLEBENCH_JAVA_OPTS adds JVM options; JAVA_HOME picks Java.
setlocal EnableDelayedExpansion
set "HERE=%~dp0.."
set "JAR=%HERE%\target\polebench.jar"
set "ARCHIVE=%HERE%\target\polebench.jsa"
if not exist "%JAR%" (
  echo polebench: %JAR% is not built yet 1>&2
  echo   fix: run 'mvn -q -DskipTests package' in %HERE% 1>&2
  exit /b 2
)
set "JAVA=java"
if defined JAVA_HOME if exist "%JAVA_HOME%\bin\java.exe" set "JAVA=%JAVA_HOME%\bin\java.exe"

set "JIT=%POLEBENCH_JIT%"
if not defined JIT (
  set "JIT=quick"
  if /i "%~1"=="batch" set "JIT=full"
  if /i "%~1"=="lot" set "JIT=full"
  for %%A in (%*) do (
    if exist "%%~A\*" set "JIT=full"
    if exist "%%~A" if %%~zA GEQ 8388608 set "JIT=full"
    if /i "%%~xA"==".yaml" if exist "%%~A" if %%~zA GTR 4096 echo %%~nA| findstr /i /e /l ".stage" >nul && set "JIT=full"
  )
)
set "JIT_OPTS="
if /i "!JIT!"=="quick" set "JIT_OPTS=-XX:TieredStopAtLevel=1 -XX:+UseSerialGC"
if /i not "!JIT!"=="quick" if /i not "!JIT!"=="full" (
  echo polebench: POLEBENCH_JIT=!JIT! is neither quick nor full 1>&2
  echo   fix: clear POLEBENCH_JIT, or set it to quick or full 1>&2
  exit /b 2
)
set "CDS_OPTS="
if exist "%ARCHIVE%" set "CDS_OPTS=-XX:SharedArchiveFile=%ARCHIVE% -Xlog:cds=off -Xlog:cds+dynamic=off"
"%JAVA%" %CDS_OPTS% !JIT_OPTS! %POLEBENCH_JAVA_OPTS% -jar "%JAR%" %*
exit /b %ERRORLEVEL%
