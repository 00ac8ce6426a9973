namespace CrossCheck.Analysis;

/// <summary>
/// A symmetric matrix assembled entry by entry; only the lower triangle (row ≥ column) is stored,
/// one dictionary per row. The assembly format every <see cref="ILinearSolver"/> accepts.
/// </summary>
public sealed class SparseSymmetricMatrix
{
    private readonly Dictionary<int, double>[] _rows;

    public SparseSymmetricMatrix(int size)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(size);
        Size = size;
        _rows = new Dictionary<int, double>[size];
        for (int i = 0; i < size; i++) _rows[i] = [];
    }

    public int Size { get; }

    /// <summary>Adds <paramref name="value"/> to entry (i, j) and, by symmetry, (j, i).</summary>
    public void Add(int i, int j, double value)
    {
        if (value == 0) return;
        if (j > i) (i, j) = (j, i);
        var row = _rows[i];
        row[j] = row.TryGetValue(j, out var old) ? old + value : value;
    }

    public double this[int i, int j]
    {
        get
        {
            if (j > i) (i, j) = (j, i);
            return _rows[i].TryGetValue(j, out var v) ? v : 0;
        }
    }

    /// <summary>Stored entries of row i with column ≤ i.</summary>
    public IEnumerable<KeyValuePair<int, double>> LowerRow(int i) => _rows[i];

    public int NonZeroCount => _rows.Sum(r => r.Count);

    /// <summary>y = A·x.</summary>
    public double[] Multiply(double[] x)
    {
        var y = new double[Size];
        for (int i = 0; i < Size; i++)
        {
            foreach (var (j, v) in _rows[i])
            {
                y[i] += v * x[j];
                if (j != i) y[j] += v * x[i];
            }
        }
        return y;
    }

    public double Diagonal(int i) => _rows[i].TryGetValue(i, out var v) ? v : 0;
}
