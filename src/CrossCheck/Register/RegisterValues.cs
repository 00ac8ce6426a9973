using System.Globalization;
using CrossCheck.Common;
using System.Data.Common;

namespace CrossCheck.Register;

/// <summary>
/// The values a register row may hold. SQLite keeps whatever a value is given, so a register edited or damaged outside
/// CrossCheck can hold text where a count belongs, a negative tolerance or a verdict CrossCheck never writes; reading such a
/// row is a <see cref="RegisterException"/> naming the review and column (exit code 2), and <c>register check</c> lists it.
/// </summary>
internal static class RegisterValues
{
    // The storage class each column of ReviewColumns must hold: i integer, t text, T text or null, r real (SQLite keeps
    // whatever a value is given, so a register edited by hand can hold text where a count belongs).
    private const string ReviewColumnTypes = "itiTTttttTtrrrtttiiiiiiiTi";

    /// <summary>Refuses a review row whose values are of the wrong kind or out of range (a register edited or damaged outside CrossCheck).</summary>
    public static void Check(DbDataReader r, string path)
    {
        for (int i = 0; i < ReviewColumnTypes.Length; i++)
        {
            char want = ReviewColumnTypes[i];
            var type = r.GetFieldType(i);
            bool ok = want switch
            {
                'i' => (type == typeof(long) || type == typeof(int)) && (i == 0 || Long(r, i) is >= 0 and <= int.MaxValue) && (i != 2 || Long(r, i) >= 1),
                'r' => type == typeof(double) || type == typeof(long) || type == typeof(int),
                'T' => type == typeof(string) || r.IsDBNull(i),
                _ => type == typeof(string),
            };
            // Values of the right kind that still mean nothing: a tolerance below zero, a verdict or a date CrossCheck never writes.
            if (ok && want == 'r') ok = Convert.ToDouble(r.GetValue(i), CultureInfo.InvariantCulture) is >= 0 and <= double.MaxValue;
            if (ok && i == 16) ok = r.GetString(i) is "concur" or "concur-with-comments" or "revise";
            if (ok && i == 7) ok = DateOnly.TryParseExact(r.GetString(i), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out _);
            if (!ok)
            {
                string value = r.IsDBNull(i) ? "no value" : $"'{TextSafety.Clean(Convert.ToString(r.GetValue(i), CultureInfo.InvariantCulture) ?? "")}'";
                throw new RegisterException(
                    $"register{(path.Length > 0 ? $" '{path}'" : "")} is damaged: review {(r.GetFieldType(0) == typeof(long) || r.GetFieldType(0) == typeof(int) ? Long(r, 0) : 0)} has {value} in '{r.GetName(i)}'. Run 'crosscheck register check', or use another register.");
            }
        }
    }

    private static long Long(DbDataReader r, int i) => Convert.ToInt64(r.GetValue(i), CultureInfo.InvariantCulture);

    /// <summary>A value of a kind or size CrossCheck never writes, met while reading.</summary>
    public static RegisterException Damaged(string path, Exception ex) =>
        new($"register '{path}' is damaged: it holds a value CrossCheck never writes ({TextSafety.Clean(ex.Message)}). Run 'crosscheck register check', or use another register.", ex);
}
