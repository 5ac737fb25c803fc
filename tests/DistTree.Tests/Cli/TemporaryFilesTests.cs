using System.Diagnostics;
using System.Runtime.InteropServices;
using DistTree.Cli;
using DistTree.ProjectFiles;

namespace DistTree.Tests.Cli;

/// <summary>
/// The temporary files outputs are written to: registered while pending, removed on every way out, and by a
/// termination signal; one test stops the built command with SIGTERM in the middle of writing.
/// </summary>
public sealed class TemporaryFilesTests
{
    [Fact]
    public void Stop_WithPendingFiles_RemovesThemAllAndMakesNoMore()
    {
        using var folder = new TempFolder();
        var registry = new TemporaryFiles();
        var (first, stream) = registry.Create(folder.File("a.json"));
        stream.Dispose();
        var (second, open) = registry.Create(folder.File("b.json"));

        registry.Stop();

        Assert.Empty(registry.Pending);
        Assert.False(File.Exists(first));
        Assert.False(File.Exists(second));
        open.Dispose();
        Assert.Throws<IOException>(() => registry.Create(folder.File("c.json")));
        Assert.Empty(Directory.GetFileSystemEntries(folder.Path));
    }

    [Fact]
    public void CommitAndDiscard_EachForgetTheFile()
    {
        using var folder = new TempFolder();
        var registry = new TemporaryFiles();
        var (kept, a) = registry.Create(folder.File("a.json"));
        a.Dispose();
        var (dropped, b) = registry.Create(folder.File("b.json"));
        b.Dispose();
        Assert.Equal([kept, dropped], registry.Pending);

        registry.Commit(kept, folder.File("a.json"), replace: true);
        registry.Discard(dropped);

        Assert.Empty(registry.Pending);
        Assert.Equal(["a.json"], Directory.GetFileSystemEntries(folder.Path).Select(Path.GetFileName));
    }

    [Fact]
    public void Create_NameAlreadyTaken_NeverOpensWhatIsThereAndTakesTheNext()
    {
        using var folder = new TempFolder();
        var taken = folder.File($".a.json.{Environment.ProcessId}.1.tmp");
        Tool.Run("mkfifo", taken);
        var registry = new TemporaryFiles();

        var (path, stream) = registry.Create(folder.File("a.json"));
        stream.Dispose();

        Assert.Equal(folder.File($".a.json.{Environment.ProcessId}.2.tmp"), path);
        Assert.Equal(FileKind.Pipe, FileIdentity.Of(taken).Kind);
        registry.Discard(path);
    }

    [Fact]
    public void Write_WriterThrows_NoTemporaryLeftAndTheExceptionGoesOn()
    {
        using var folder = new TempFolder();
        var context = new CliContext(TextWriter.Null, TextWriter.Null);
        var output = folder.File("out.json");

        Assert.Throws<InvalidOperationException>(() => OutputFile.Write(context, output, _ => throw new InvalidOperationException("a defect"), []));

        Assert.Empty(Directory.GetFileSystemEntries(folder.Path));
        Assert.DoesNotContain(TemporaryFiles.Process.Pending, p => p.StartsWith(folder.Path, StringComparison.Ordinal));
    }

    [Fact]
    public void Write_AnyFile_TerminationSignalsHaveAHandler()
    {
        using var folder = new TempFolder();
        OutputFile.Write(new CliContext(TextWriter.Null, TextWriter.Null), folder.File("x.txt"), "x", []);

        Assert.Contains(PosixSignal.SIGTERM, TemporaryFiles.HandledSignals);
        Assert.Contains(PosixSignal.SIGINT, TemporaryFiles.HandledSignals);
    }

    // The built command on a generated project of 30,000 end points (a results document of about 45 MB), sent SIGTERM
    // as soon as its temporary file appears: it ends by the signal, and leaves neither the temporary file nor a partial
    // output. Should the command finish first (a slow poll on a busy machine), it is run again, up to three times.
    [Fact]
    public void Analyze_SigtermWhileWriting_LeavesNoTemporaryFile()
    {
        using var folder = new TempFolder();
        var project = folder.File("big.yaml");
        Assert.Equal(0, CliRunner.Run("generate", "--end-points", "30000", "--seed", "7", "--output", project).ExitCode);
        var output = folder.File("out.json");
        for (var attempt = 0; attempt < 3; attempt++)
        {
            var exitCode = RunAndTerminate(folder, project, output);
            Assert.Empty(Directory.EnumerateFiles(folder.Path, "*.tmp"));
            if (exitCode == 143)
            {
                // 128 + SIGTERM (15): ended by the signal, with nothing written in place of the output.
                Assert.False(File.Exists(output));
                return;
            }

            Assert.Equal(0, exitCode);
            File.Delete(output);
        }

        Assert.Fail("the command finished before the signal came, three times");
    }

    // Starts analyze writing to output, sends SIGTERM once its temporary file is there; the exit code.
    private static int RunAndTerminate(TempFolder folder, string project, string output)
    {
        var start = new ProcessStartInfo(Path.Combine(AppContext.BaseDirectory, "DistTree.Cli"), ["analyze", project, "--json", output])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        using var process = Process.Start(start)!;
        var drained = Task.WhenAll(process.StandardOutput.ReadToEndAsync(), process.StandardError.ReadToEndAsync());
        var clock = Stopwatch.StartNew();
        while (!process.HasExited && clock.Elapsed < TimeSpan.FromSeconds(120))
        {
            if (Directory.EnumerateFiles(folder.Path, ".out.json.*.tmp").Any())
            {
                Tool.Run("kill", "-TERM", process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture));
                break;
            }

            Thread.Sleep(1);
        }

        Assert.True(process.WaitForExit(60_000), "the command did not end");
        drained.Wait();
        return process.ExitCode;
    }
}
