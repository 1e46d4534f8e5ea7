namespace Anneal.Formats.Output;

/// <summary>Tells a full disk (or a spent quota) from other write failures: it is the machine's fault, not the job's.</summary>
public static class DiskFull
{
    // .NET on Unix keeps the errno as the HResult; on Windows it is the Win32 error as an HRESULT.
    private const int Enospc = 28;
    private const int Edquot = 122;
    private const int WinDiskFull = unchecked((int)0x80070070);
    private const int WinHandleDiskFull = unchecked((int)0x80070027);

    /// <summary>True when <paramref name="e"/> or an exception inside it says there is no space left.</summary>
    public static bool Is(Exception? e)
    {
        for (; e is not null; e = e.InnerException)
        {
            if (e is IOException && e.HResult is Enospc or Edquot or WinDiskFull or WinHandleDiskFull)
            {
                return true;
            }
        }

        return false;
    }
}
