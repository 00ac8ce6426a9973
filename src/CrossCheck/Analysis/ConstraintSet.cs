namespace CrossCheck.Analysis;

/// <summary>
/// Linear constraints on the joint displacements (supports, prescribed movements, axially rigid members),
/// eliminated exactly by master–slave substitution: every slave DOF becomes a combination of master DOFs
/// plus a constant, so d = T·q + d0 with q the independent unknowns. No penalty numbers are involved.
/// </summary>
internal sealed class ConstraintSet
{
    private const double DropTolerance = 1e-12;
    private const double RedundantTolerance = 1e-10;

    private readonly int _dofCount;
    private readonly Dictionary<int, Expression> _slaves = [];
    private readonly Dictionary<int, HashSet<int>> _usedBy = [];
    private readonly List<Row> _rows = [];

    public ConstraintSet(int dofCount) => _dofCount = dofCount;

    /// <summary>Every constraint added, in order (for recovering constraint forces).</summary>
    public IReadOnlyList<Row> Rows => _rows;

    /// <summary>Adds Σ coef·d = rhs. Returns false when it contradicts earlier constraints.</summary>
    public bool Add(IReadOnlyDictionary<int, double> coefficients, double rhs, object tag, out bool redundant)
    {
        var row = new Row(coefficients as Dictionary<int, double> ?? coefficients.ToDictionary(), rhs, tag);
        _rows.Add(row);
        // Substitute existing slave expressions.
        var terms = new Dictionary<int, double>(coefficients.Count + 4);
        double constant = rhs;
        double scale = 0;
        foreach (var (dof, coef) in coefficients)
        {
            scale = Math.Max(scale, Math.Abs(coef));
            if (_slaves.TryGetValue(dof, out var expr))
            {
                constant -= coef * expr.Constant;
                foreach (var (m, c) in expr.Terms) terms[m] = terms.GetValueOrDefault(m) + (coef * c);
            }
            else
            {
                terms[dof] = terms.GetValueOrDefault(dof) + coef;
            }
        }
        int pivot = -1;
        double best = 0;
        double floor = RedundantTolerance * Math.Max(scale, 1e-300);
        foreach (var (m, c) in terms)
        {
            double a = Math.Abs(c);
            if (a <= floor) continue;
            // Largest coefficient; on a tie the later DOF becomes the slave, so earlier joints stay independent.
            if (pivot < 0 || a > best * (1 + 1e-9) || (a >= best * (1 - 1e-9) && m > pivot)) { best = a; pivot = m; }
        }
        if (pivot < 0)
        {
            redundant = true;
            return Math.Abs(constant) <= 1e-9 * (1 + Math.Abs(rhs));
        }
        redundant = false;
        double pc = terms[pivot];
        var newExpr = new Expression(constant / pc);
        foreach (var (m, c) in terms)
        {
            if (m == pivot) continue;
            double v = -c / pc;
            if (Math.Abs(c) > floor && Math.Abs(v) > DropTolerance) newExpr.Terms[m] = v;
        }
        // Replace the pivot in every slave that used it.
        if (_usedBy.Remove(pivot, out var users))
        {
            foreach (int s in users)
            {
                var e = _slaves[s];
                double factor = e.Terms[pivot];
                e.Terms.Remove(pivot);
                e.Constant += factor * newExpr.Constant;
                foreach (var (m, c) in newExpr.Terms)
                {
                    double v = e.Terms.GetValueOrDefault(m) + (factor * c);
                    if (Math.Abs(v) > DropTolerance) { e.Terms[m] = v; Use(m, s); }
                    else { e.Terms.Remove(m); _usedBy.GetValueOrDefault(m)?.Remove(s); }
                }
            }
        }
        _slaves[pivot] = newExpr;
        foreach (var m in newExpr.Terms.Keys) Use(m, pivot);
        return true;
    }

    private void Use(int master, int slave)
    {
        if (!_usedBy.TryGetValue(master, out var set)) _usedBy[master] = set = [];
        set.Add(slave);
    }

    public bool IsSlave(int dof) => _slaves.ContainsKey(dof);

    /// <summary>Builds d = T·q + d0: for every DOF its master terms (by master index) and its constant.</summary>
    public Transformation Build()
    {
        var masterIndex = new int[_dofCount];
        var masters = new List<int>();
        for (int i = 0; i < _dofCount; i++)
        {
            if (_slaves.ContainsKey(i)) { masterIndex[i] = -1; continue; }
            masterIndex[i] = masters.Count;
            masters.Add(i);
        }
        var terms = new (int Master, double Coef)[_dofCount][];
        var constants = new double[_dofCount];
        for (int i = 0; i < _dofCount; i++)
        {
            if (_slaves.TryGetValue(i, out var e))
            {
                terms[i] = e.Terms.Select(kv => (masterIndex[kv.Key], kv.Value)).ToArray();
                constants[i] = e.Constant;
            }
            else
            {
                terms[i] = [(masterIndex[i], 1.0)];
            }
        }
        return new Transformation(masters.ToArray(), terms, constants);
    }

    internal sealed class Expression(double constant)
    {
        public double Constant { get; set; } = constant;
        public Dictionary<int, double> Terms { get; } = [];
    }

    internal sealed record Row(Dictionary<int, double> Coefficients, double Rhs, object Tag);
}

/// <summary>d = T·q + d0, stored row by row.</summary>
internal sealed record Transformation(int[] Masters, (int Master, double Coef)[][] Terms, double[] Constants)
{
    public int MasterCount => Masters.Length;

    public double[] Expand(double[] q)
    {
        var d = new double[Terms.Length];
        for (int i = 0; i < d.Length; i++)
        {
            double s = Constants[i];
            foreach (var (m, c) in Terms[i]) s += c * q[m];
            d[i] = s;
        }
        return d;
    }

    /// <summary>Tᵀ·f.</summary>
    public double[] Reduce(double[] f)
    {
        var r = new double[MasterCount];
        for (int i = 0; i < Terms.Length; i++)
        {
            if (f[i] == 0) continue;
            foreach (var (m, c) in Terms[i]) r[m] += c * f[i];
        }
        return r;
    }
}
