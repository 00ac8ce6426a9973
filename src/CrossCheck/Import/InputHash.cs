using System.Security.Cryptography;
using System.Text;

namespace CrossCheck.Import;

/// <summary>
/// A fingerprint of a submission's input files, so a register can tell a resubmission from the same files reviewed
/// again. SHA-256 over the file names and bytes of what <see cref="SubmissionReader"/> reads: the file itself, or
/// every CSV file directly in the folder (in ordinal name order).
/// </summary>
public static class InputHash
{
    /// <summary><c>sha256:</c> followed by 64 hex digits; null when the path does not exist or cannot be read.</summary>
    public static string? Compute(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        try
        {
            using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
            if (Directory.Exists(path))
            {
                var files = Directory.GetFiles(path).Where(f => Path.GetExtension(f).ToLowerInvariant() is ".csv" or ".tsv")
                    .Order(StringComparer.Ordinal);
                foreach (var f in files) Add(hash, Path.GetFileName(f), f);
            }
            else if (File.Exists(path))
            {
                Add(hash, "", path);
            }
            else
            {
                return null;
            }
            return "sha256:" + Convert.ToHexStringLower(hash.GetHashAndReset());
        }
        catch (IOException)
        {
            return null;
        }
        catch (UnauthorizedAccessException)
        {
            return null;
        }
    }

    /// <summary>Larger than any file the readers accept (a PDF of 100 MB, raised limits aside).</summary>
    private const long MaxBytes = 2L * 1024 * 1024 * 1024 - 64;

    private static void Add(IncrementalHash hash, string name, string file)
    {
        // Bounded and regular files only, as the readers: a table linked to /dev/zero must not hang the hash either.
        byte[] bytes = Common.InputFile.Read(file, MaxBytes);
        hash.AppendData(Encoding.UTF8.GetBytes(name));
        hash.AppendData([0]);
        hash.AppendData(BitConverter.GetBytes((long)bytes.Length));
        hash.AppendData(bytes);
    }
}
