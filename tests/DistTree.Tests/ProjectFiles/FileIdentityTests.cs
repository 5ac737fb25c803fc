using System.Net.Sockets;
using DistTree.ProjectFiles;
using DistTree.Tests.Cli;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// What stands at a path, and which file it is (device and inode, from Linux's statx(2)): checked against the kinds
/// the system's own tools make (mkfifo, ln, a bound socket) and against the files the system provides (/dev/null).
/// </summary>
public sealed class FileIdentityTests
{
    [Fact]
    public void Of_EachKindOfPath_TheKindTheSystemMade()
    {
        using var folder = new TempFolder();
        File.WriteAllText(folder.File("file"), "x");
        Tool.Run("mkfifo", folder.File("pipe"));
        using var socket = new Socket(AddressFamily.Unix, SocketType.Stream, ProtocolType.Unspecified);
        socket.Bind(new UnixDomainSocketEndPoint(folder.File("socket")));

        Assert.Equal(FileKind.Regular, FileIdentity.Of(folder.File("file")).Kind);
        Assert.Equal(FileKind.Folder, FileIdentity.Of(folder.Path).Kind);
        Assert.Equal(FileKind.Pipe, FileIdentity.Of(folder.File("pipe")).Kind);
        Assert.Equal(FileKind.Socket, FileIdentity.Of(folder.File("socket")).Kind);
        Assert.Equal(FileKind.Device, FileIdentity.Of("/dev/null").Kind);
        Assert.Equal((FileKind.Missing, null), FileIdentity.Of(folder.File("nothing")));
        Assert.Equal((FileKind.Missing, null), FileIdentity.Of(Path.Combine(folder.File("file"), "below")));
    }

    [Fact]
    public void Of_OtherNamesOfOneFile_OneIdentity_AndAnotherFileAnother()
    {
        using var folder = new TempFolder();
        var file = folder.File("a.yaml");
        File.WriteAllText(file, "x");
        File.WriteAllText(folder.File("b.yaml"), "x");
        Tool.Run("ln", file, folder.File("hard.yaml"));
        File.CreateSymbolicLink(folder.File("soft.yaml"), file);
        Directory.CreateSymbolicLink(folder.File("linked"), folder.Path);

        var identity = FileIdentity.Of(file).Identity;

        Assert.NotNull(identity);
        Assert.Equal(identity, FileIdentity.Of(folder.File("hard.yaml")).Identity);
        Assert.Equal(identity, FileIdentity.Of(folder.File("soft.yaml")).Identity);
        Assert.Equal(identity, FileIdentity.Of(Path.Combine(folder.File("linked"), "a.yaml")).Identity);
        Assert.NotEqual(identity, FileIdentity.Of(folder.File("b.yaml")).Identity);
    }

    [Fact]
    public void Of_AnOpenFile_TheIdentityOfItsPath_EvenOnceRenamed()
    {
        using var folder = new TempFolder();
        var file = folder.File("a.yaml");
        File.WriteAllText(file, "x");
        var before = FileIdentity.Of(file).Identity;
        using var stream = File.OpenRead(file);
        File.Move(file, folder.File("moved.yaml"));

        Assert.Equal(before, FileIdentity.Of(stream.SafeFileHandle));
    }
}
