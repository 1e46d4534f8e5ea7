using System.Runtime.InteropServices;

namespace Anneal.Worker.Untrusted;

/// <summary>
/// The type of a file as the kernel records it, read without following links. .NET reports pipes, sockets and
/// devices as ordinary files of length 0, and opening a pipe to read it blocks, so the type comes from Linux's
/// <c>statx</c>, whose layout is the same on every architecture. Elsewhere the type is unknown (null).
/// </summary>
internal static partial class FileKind
{
    private const int AtFdCwd = -100;
    private const int AtSymlinkNoFollow = 0x100;
    private const uint StatxType = 0x1;
    private const int ModeOffset = 28; // struct statx: stx_mode, a 16-bit field after mask, blksize, attributes, nlink, uid, gid
    private const int TypeMask = 0xF000;
    private const int Regular = 0x8000;
    private const int Directory = 0x4000;

    /// <summary>True for a plain file or folder, false for anything else (link, pipe, socket, device); null when unknown.</summary>
    public static bool? IsPlain(string path)
    {
        if (!OperatingSystem.IsLinux())
        {
            return null;
        }

        var buffer = new byte[256];
        try
        {
            if (Statx(AtFdCwd, path, AtSymlinkNoFollow, StatxType, buffer) != 0)
            {
                return null;
            }
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return null;
        }

        int type = BitConverter.ToUInt16(buffer, ModeOffset) & TypeMask;
        return type is Regular or Directory;
    }

    [LibraryImport("libc", EntryPoint = "statx", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int Statx(int dirfd, string path, int flags, uint mask, [Out] byte[] buffer);
}
