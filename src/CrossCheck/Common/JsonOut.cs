using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;

namespace CrossCheck.Common;

/// <summary>
/// A small wrapper over <see cref="Utf8JsonWriter"/> for the JSON outputs: written field by field, with no
/// reflection, so that a one-off command does not pay for building serialisation metadata at start-up.
/// </summary>
internal sealed class JsonOut : IDisposable
{
    private readonly MemoryStream _buffer = new();
    private readonly Utf8JsonWriter _w;

    public JsonOut() => _w = new Utf8JsonWriter(_buffer, new JsonWriterOptions { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping });

    public JsonOut Obj() { _w.WriteStartObject(); return this; }
    public JsonOut Obj(string name) { _w.WriteStartObject(name); return this; }
    public JsonOut EndObj() { _w.WriteEndObject(); return this; }
    public JsonOut Arr(string name) { _w.WriteStartArray(name); return this; }
    public JsonOut EndArr() { _w.WriteEndArray(); return this; }

    public JsonOut Str(string name, string? value)
    {
        if (value is null) _w.WriteNull(name); else _w.WriteString(name, value);
        return this;
    }

    public JsonOut Num(string name, double? value)
    {
        if (value is double v && double.IsFinite(v)) _w.WriteNumber(name, v); else _w.WriteNull(name);
        return this;
    }

    public JsonOut Int(string name, long? value)
    {
        if (value is long v) _w.WriteNumber(name, v); else _w.WriteNull(name);
        return this;
    }

    public JsonOut Bool(string name, bool value) { _w.WriteBoolean(name, value); return this; }
    public JsonOut Null(string name) { _w.WriteNull(name); return this; }

    public JsonOut Strings(string name, IEnumerable<string> values)
    {
        _w.WriteStartArray(name);
        foreach (var v in values) _w.WriteStringValue(v);
        _w.WriteEndArray();
        return this;
    }

    /// <summary>Array of objects, one per item.</summary>
    public JsonOut Each<T>(string name, IEnumerable<T> items, Action<JsonOut, T> write)
    {
        _w.WriteStartArray(name);
        foreach (var item in items)
        {
            _w.WriteStartObject();
            write(this, item);
            _w.WriteEndObject();
        }
        _w.WriteEndArray();
        return this;
    }

    /// <summary>An object, or null when <paramref name="item"/> is null.</summary>
    public JsonOut Maybe<T>(string name, T? item, Action<JsonOut, T> write) where T : class
    {
        if (item is null) { _w.WriteNull(name); return this; }
        _w.WriteStartObject(name);
        write(this, item);
        _w.WriteEndObject();
        return this;
    }

    public override string ToString()
    {
        _w.Flush();
        return Encoding.UTF8.GetString(_buffer.ToArray()) + "\n";
    }

    public void Dispose()
    {
        _w.Dispose();
        _buffer.Dispose();
    }
}
