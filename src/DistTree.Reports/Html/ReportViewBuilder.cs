using DistTree.Conductors;
using DistTree.Model;
using DistTree.Network;
using DistTree.Solving;
using DistTree.Vocabulary;
using static DistTree.Reports.Html.HtmlText;

namespace DistTree.Reports.Html;

/// <summary>
/// Turns a solution into the escaped, formatted view the template prints. It selects, sorts and formats the
/// solver's figures; it computes no electrical figure. Per-node data are gathered once into arrays indexed
/// by node, in loops over the parent-first node array, so the work grows linearly with the tree.
/// </summary>
internal sealed class ReportViewBuilder
{
    /// <summary>End points above which each panel lists only its worst circuits.</summary>
    public const int LargeProjectEndPoints = 2000;

    /// <summary>Circuits listed per panel in a large project.</summary>
    public const int LargeProjectRowsPerPanel = 10;

    /// <summary>Findings listed per kind in a large project.</summary>
    public const int LargeProjectFindingsPerKind = 200;

    /// <summary>Equipment nodes drawn in the tree at most.</summary>
    public const int TreeNodeCap = 300;

    /// <summary>Trees this deep or less are scaled to the page width; deeper ones scroll sideways (and scale when printed).</summary>
    public const int FitDepth = 8;

    /// <summary>Motors listed in the starting table at most (worst dip first).</summary>
    public const int MotorRowsCap = 200;

    /// <summary>The share of the total limit from which an end point counts as near its limit.</summary>
    public const double NearFraction = 0.8;

    private const int BandNone = -1;
    private const int BandOk = 0;
    private const int BandNear = 1;
    private const int BandOver = 2;

    private readonly Solution _s;
    private readonly HtmlReportOptions _options;
    private readonly IReadOnlyList<NetworkNode> _nodes;
    private readonly int[] _incomingRow;
    private readonly int[] _transformerRow;
    private readonly int[] _endPointOf;
    private readonly int[] _endPointBand;
    private readonly double[] _worstBelow;
    private readonly int[] _bandBelow;
    private readonly int[] _findingsBelow;
    private readonly int[] _ownCircuits;
    private readonly double[] _worstOwn;
    private readonly int[] _bandOwn;
    private readonly bool _large;

    private ReportViewBuilder(Solution solution, HtmlReportOptions options)
    {
        _s = solution;
        _options = options;
        _nodes = solution.Network.Nodes;
        var n = _nodes.Count;
        _incomingRow = Filled(n, -1);
        _transformerRow = Filled(n, -1);
        _endPointOf = Filled(n, -1);
        _endPointBand = new int[solution.EndPoints.Count];
        _worstBelow = new double[n];
        _bandBelow = Filled(n, BandNone);
        _findingsBelow = new int[n];
        _ownCircuits = new int[n];
        _worstOwn = new double[n];
        _bandOwn = Filled(n, BandNone);
        Array.Fill(_worstBelow, double.NegativeInfinity);
        Array.Fill(_worstOwn, double.NegativeInfinity);
        _large = solution.EndPoints.Count > LargeProjectEndPoints;
        Gather();
    }

    /// <summary>Builds the view of <paramref name="solution"/>.</summary>
    public static ReportView Build(Solution solution, HtmlReportOptions options, string css) =>
        new ReportViewBuilder(solution, options).Build(css);

    private static int[] Filled(int n, int value)
    {
        var a = new int[n];
        Array.Fill(a, value);
        return a;
    }

    private void Gather()
    {
        for (var r = 0; r < _s.Runs.Count; r++)
        {
            var run = _s.Runs[r];
            if (run.Kind == RunResultKind.Transformer)
            {
                _transformerRow[run.NodeIndex] = r;
            }
            else
            {
                _incomingRow[run.NodeIndex] = r;
            }

            _findingsBelow[run.NodeIndex] += run.Findings.Count;
        }

        for (var k = 0; k < _s.EndPoints.Count; k++)
        {
            var e = _s.EndPoints[k];
            var i = e.NodeIndex;
            _endPointOf[i] = k;
            _endPointBand[k] = BandOf(e);
            _worstBelow[i] = e.TotalDropPercent;
            _bandBelow[i] = _endPointBand[k];
            _findingsBelow[i] += e.Findings.Count;
            var panel = _nodes[i].ParentIndex;
            _ownCircuits[panel]++;
            _worstOwn[panel] = Math.Max(_worstOwn[panel], e.TotalDropPercent);
            _bandOwn[panel] = Math.Max(_bandOwn[panel], _endPointBand[k]);
        }

        for (var i = _nodes.Count - 1; i > 0; i--)
        {
            var parent = _nodes[i].ParentIndex;
            _worstBelow[parent] = Math.Max(_worstBelow[parent], _worstBelow[i]);
            _bandBelow[parent] = Math.Max(_bandBelow[parent], _bandBelow[i]);
            _findingsBelow[parent] += _findingsBelow[i];
        }
    }

    private static int BandOf(EndPointResult e)
    {
        if (e.Findings.Any(f => f.Kind == FindingKind.TotalDrop))
        {
            return BandOver;
        }

        return e.TotalDropPercent >= NearFraction * e.LimitPercent ? BandNear : BandOk;
    }

    private static string BandClass(int band) => band switch
    {
        BandOver => "over",
        BandNear => "near",
        BandOk => "ok",
        _ => "none",
    };

    private static string BandText(int band) => band switch
    {
        BandOver => "over limit",
        BandNear => "near limit",
        BandOk => "within limit",
        _ => "no circuits",
    };

    private ReportView Build(string css)
    {
        var p = _s.Project;
        var rules = p.Rules;
        var summary = _s.Summary;
        var worstIndex = -1;
        if (summary.WorstEndPoint is { } worstId)
        {
            for (var k = 0; k < _s.EndPoints.Count && worstIndex < 0; k++)
            {
                if (string.Equals(_s.EndPoints[k].Id, worstId, StringComparison.Ordinal))
                {
                    worstIndex = k;
                }
            }
        }

        EndPointResult? worst = worstIndex >= 0 ? _s.EndPoints[worstIndex] : null;
        var equipmentCount = _nodes.Count(node => node.Kind is not NodeKind.EndPoint and not NodeKind.Service);
        var panelCount = _nodes.Count(node => node.Kind == NodeKind.Panelboard);
        var motors = MotorIndices();
        var numbers = Numbers(motors.Count > 0);
        var loadFlow = _s.LoadFlow;
        return new ReportView
        {
            Title = Escape(_options.Title ?? $"{p.Name} · voltage-drop review"),
            ProjectName = Escape(p.Name),
            File = Escape(p.File),
            Sha256 = Escape(p.Sha256),
            Date = _options.Date is null ? null : Escape(_options.Date),
            CatalogName = Escape(_s.CatalogName),
            Rules = Escape(RuleText.Summary(rules)),
            Caution = Escape(Caution.Text),
            Css = css,
            VerdictClass = _s.HasFindings ? "fail" : "pass",
            VerdictText = _s.HasFindings
                ? $"{Count(summary.Findings)} finding{(summary.Findings == 1 ? "" : "s")}: limits exceeded"
                : "Every run and end point is within its limits",
            Counts =
            [
                new("end points", Count(summary.EndPoints)),
                new("runs", Count(summary.Runs)),
                new("equipment", Count(equipmentCount)),
                new("panelboards", Count(panelCount)),
                new("findings", Count(summary.Findings)),
            ],
            WorstId = worst is { } w ? Escape(w.Id) : null,
            WorstName = worst is { } v ? Escape(v.Name) : null,
            WorstTotal = Percent(summary.WorstTotalDropPercent),
            WorstBand = worst is null ? "none" : BandClass(_endPointBand[worstIndex]),
            TotalLimit = Limit(rules.TotalLimitPercent),
            Limits = LimitRows(rules),
            FindingKinds = KindCounts(),
            Paths = BuildPaths(),
            Tree = BuildTree(),
            Panels = BuildPanels(),
            PanelRule = _large
                ? $"This project has {Count(_s.EndPoints.Count)} end points (more than {LargeProjectEndPoints:#,0}): each panel lists its {LargeProjectRowsPerPanel} worst circuits, and a closing line counts the rest and how many of them exceed a limit. The JSON results (--json) list every circuit."
                : null,
            ShowFeet = p.Units == UnitSystem.Imperial,
            Findings = BuildFindings(),
            FindingsRule = _large
                ? $"In a project this large each kind lists its first {LargeProjectFindingsPerKind} findings in network order; the console output and the JSON results list all."
                : null,
            Plan = _options.Plan is { } plan ? BuildPlan(plan) : null,
            Comparison = _options.Comparison is { } comparison ? ComparisonViewBuilder.Build(comparison, PanelAnchors()) : null,
            Num = numbers,
            MethodText = MethodName(rules.Method),
            OtherMethodText = MethodName(Other(rules.Method)),
            LoadFlowText = loadFlow.Converged
                ? $"converged in {Count(loadFlow.Iterations)} sweep{(loadFlow.Iterations == 1 ? "" : "s")} (tolerance {Tolerance} pu)"
                : $"did not converge in {Count(loadFlow.Iterations)} sweeps (tolerance {Tolerance} pu); its figures are left out",
            LoadFlowClass = loadFlow.Converged ? "pass" : "fail",
            Tolerance = Tolerance,
            Motors = motors.Take(MotorRowsCap).Select(MotorRowOf).ToArray(),
            MotorsMore = motors.Count > MotorRowsCap ? $"{Count(motors.Count - MotorRowsCap)} more motors with smaller dips, listed in the JSON results." : null,
            MotorLimit = Limit(rules.MotorStartLimitPercent),
            AnyPoints = _nodes.Any(node => node.Circuit is { Points.Count: > 0 }),
            CatalogHeader = string.Equals(_s.CatalogName, ConductorCatalog.Standard.SourceName, StringComparison.Ordinal)
                ? ConductorCatalog.Standard.Header.Select(Escape).ToArray()
                : [],
            RuleMeanings = Meanings(rules),
            NearPercent = Count((int)Math.Round(NearFraction * 100)),
        };
    }

    private LimitRow[] LimitRows(Rules rules)
    {
        var byKind = new int[Enum.GetValues<FindingKind>().Length];
        foreach (var f in _s.AllFindings)
        {
            byKind[(int)f.Kind]++;
        }

        int feeders = 0, branches = 0, transformers = 0, withAmpacity = 0, withOcpd = 0;
        double worstFeeder = double.NegativeInfinity, worstBranch = double.NegativeInfinity;
        foreach (var r in _s.Runs)
        {
            switch (r.Kind)
            {
                case RunResultKind.Feeder:
                    feeders++;
                    worstFeeder = Math.Max(worstFeeder, r.DropPercent);
                    break;
                case RunResultKind.Branch:
                    branches++;
                    worstBranch = Math.Max(worstBranch, r.DropPercent);
                    break;
                default:
                    transformers++;
                    break;
            }

            if (r.Kind != RunResultKind.Transformer && r.AmpacityA is not null)
            {
                withAmpacity++;
            }

            if (r.OcpdA is not null)
            {
                withOcpd++;
            }
        }

        LimitRow Row(string limit, int checkedCount, FindingKind kind, string worst)
        {
            var name = FindingKinds.Of(kind).Check;
            var over = byKind[(int)kind];
            var status = checkedCount == 0 ? "none" : over > 0 ? "fail" : "pass";
            var text = checkedCount == 0 ? "nothing to check" : over > 0 ? "fail" : "pass";
            return new LimitRow(name, limit, Count(checkedCount), Count(over), worst, status, text);
        }

        var motors = 0;
        var worstDip = double.NegativeInfinity;
        foreach (var e in _s.EndPoints)
        {
            if (e.MotorStart is { } m)
            {
                motors++;
                worstDip = Math.Max(worstDip, m.TerminalDipPercent);
            }
        }

        static string Worst(double v) => double.IsNegativeInfinity(v) ? "–" : Percent(v) + " %";
        return
        [
            Row(Limit(rules.FeederLimitPercent) + " %", feeders, FindingKind.FeederDrop, Worst(worstFeeder)),
            Row(Limit(rules.BranchLimitPercent) + " %", branches, FindingKind.BranchDrop, Worst(worstBranch)),
            Row(Limit(rules.TotalLimitPercent) + " %", _s.EndPoints.Count, FindingKind.TotalDrop, _s.EndPoints.Count == 0 ? "–" : Percent(_s.Summary.WorstTotalDropPercent) + " %"),
            Row("allowable ampacity", withAmpacity, FindingKind.Ampacity, "–"),
            Row("conductor ampacity", withOcpd, FindingKind.OcpdAboveAmpacity, "–"),
            Row("nameplate kVA", transformers, FindingKind.TransformerOverload, "–"),
            Row(Limit(rules.MotorStartLimitPercent) + " %", motors, FindingKind.MotorStart, Worst(worstDip)),
        ];
    }

    private static string KindTitle(FindingKind kind) => FindingKinds.Of(kind).Title;

    private List<Finding>[] FindingsByKind()
    {
        var groups = Enum.GetValues<FindingKind>().Select(_ => new List<Finding>()).ToArray();
        foreach (var f in _s.AllFindings)
        {
            groups[(int)f.Kind].Add(f);
        }

        return groups;
    }

    private KindCount[] KindCounts() =>
        FindingsByKind()
            .Select((list, k) => (list, kind: (FindingKind)k))
            .Where(g => g.list.Count > 0)
            .Select(g => new KindCount(Escape(g.list[0].Code), KindTitle(g.kind), Count(g.list.Count), "kind-" + g.list[0].Code))
            .ToArray();

    private FindingGroup[] BuildFindings() =>
        FindingsByKind()
            .Select((list, k) => (list, kind: (FindingKind)k))
            .Where(g => g.list.Count > 0)
            .Select(g =>
            {
                var shown = _large ? g.list.Take(LargeProjectFindingsPerKind).ToList() : g.list;
                var more = g.list.Count - shown.Count;
                return new FindingGroup(
                    Escape(g.list[0].Code),
                    KindTitle(g.kind),
                    "kind-" + g.list[0].Code,
                    Count(g.list.Count),
                    shown.Select(f => new FindingItem(Escape(f.Subject), Escape(f.Message), Escape(Where(f.Location)))).ToArray(),
                    more > 0 ? $"{Count(more)} more of this kind, listed in the JSON results." : null);
            })
            .ToArray();

    private static string Where(Diagnostics.SourceLocation location) =>
        location.Line == 0 ? "(no source location)" : location.ToString();

    private static string Conductor(RunResult r)
    {
        if (r.Kind == RunResultKind.Transformer || r.Size is null)
        {
            return "regulation";
        }

        var sets = r.Sets > 1 ? $"{r.Sets}× " : "";
        return Escape($"{sets}{r.Size} {r.Material}");
    }

    private static string KindText(RunResultKind kind) => Words.RunKind.Of(kind);

    private static string KindClass(RunResultKind kind) => kind switch
    {
        RunResultKind.Feeder => "feeder",
        RunResultKind.Branch => "branch",
        _ => "xfmr",
    };

    private static string Codes(IEnumerable<Finding> findings) =>
        Escape(string.Join(", ", findings.Select(f => f.Code).Distinct(StringComparer.Ordinal)));

    // Worst paths: one percent axis shared by every bar so that bars compare at a glance.
    private PathsView BuildPaths()
    {
        const double width = 720;
        var shown = _options.Worst > 0 ? _s.WorstEndPoints(_options.Worst) : [];
        var limit = _s.Project.Rules.TotalLimitPercent;
        var top = limit * 1.2;
        foreach (var e in shown)
        {
            var stacked = e.RunSharesPercent.Sum(d => Math.Max(0, d));
            top = Math.Max(top, Math.Max(e.TotalDropPercent, stacked) * 1.04);
        }

        var step = top <= 8 ? 1.0 : top <= 16 ? 2.0 : top <= 40 ? 5.0 : Math.Pow(10, Math.Ceiling(Math.Log10(top / 4)));
        var axisMax = Math.Ceiling(top / step) * step;
        double X(double percent) => width * percent / axisMax;
        var ticks = new List<AxisTick>();
        for (var t = 0.0; t <= axisMax + 1e-9; t += step)
        {
            ticks.Add(new AxisTick(Coordinate(X(t)), Limit(t)));
        }

        var items = new List<PathView>(shown.Count);
        var rank = 0;
        foreach (var e in shown)
        {
            rank++;
            var segments = new List<BarSegment>();
            var rows = new List<PathRunRow>();
            var x = 0.0;
            var number = 0;
            // Each run's share is the drop on this end point's own lines (a feeder's worst line may be another).
            foreach (var (i, share) in e.RunIndices.Zip(e.RunSharesPercent))
            {
                number++;
                var r = _s.Runs[i];
                var w = X(Math.Max(0, share));
                segments.Add(new BarSegment(
                    Coordinate(x),
                    Coordinate(w),
                    KindClass(r.Kind),
                    Count(number),
                    w >= 16,
                    Coordinate(x + (w / 2)),
                    Escape($"{number}. {r.Id} ({KindText(r.Kind)}): {Percent(share)} %")));
                x += w;
                rows.Add(new PathRunRow(
                    Count(number),
                    Escape(r.Id),
                    KindClass(r.Kind),
                    KindText(r.Kind),
                    Conductor(r),
                    r.Kind == RunResultKind.Transformer ? "–" : Metres(r.LengthM),
                    r.Kind == RunResultKind.Transformer ? "–" : Feet(r.LengthM),
                    Amperes(r.CurrentA),
                    Percent(share),
                    r.LimitPercent is null ? "–" : Limit(r.LimitPercent),
                    Codes(r.Findings),
                    r.Findings.Count > 0));
            }

            var band = _endPointBand[_endPointOf[e.NodeIndex]];
            items.Add(new PathView
            {
                Rank = Count(rank),
                Id = Escape(e.Id),
                Name = Escape(e.Name),
                Route = string.Join(" → ", e.Path.Select(Escape)),
                Total = Percent(e.TotalDropPercent),
                Limit = Limit(e.LimitPercent),
                Band = BandClass(band),
                BandText = BandText(band),
                EndVoltage = Metres(e.EndVoltageV) + " V of " + Limit(e.VoltageV) + " V",
                BarWidth = Coordinate(x),
                Segments = segments,
                Runs = rows,
            });
        }

        return new PathsView(
            Count(shown.Count),
            Coordinate(width),
            Coordinate(width + 40),
            Coordinate(X(limit)),
            Coordinate(X(NearFraction * limit)),
            Coordinate(X(limit) - X(NearFraction * limit)),
            Coordinate(Math.Max(0, width - X(limit))),
            Limit(limit),
            ticks,
            items);
    }

    // The equipment tree, left to right: depth is the column, leaves take rows in depth-first order.
    private TreeView BuildTree()
    {
        const double margin = 12, nodeW = 174, nodeH = 54, colW = 202, rowH = 64;
        var layout = TreeLayout.Compute(_nodes, TreeNodeCap);
        var views = new List<TreeNodeView>(layout.Order.Count);
        var edges = new List<TreeEdge>(layout.Order.Count);
        foreach (var i in layout.Order)
        {
            var node = _nodes[i];
            var x = margin + (layout.Depth[i] * colW);
            var y = margin + (layout.Row[i] * rowH);
            if (node.ParentIndex >= 0)
            {
                var parent = node.ParentIndex;
                var px = margin + (layout.Depth[parent] * colW) + nodeW;
                var py = margin + (layout.Row[parent] * rowH) + (nodeH / 2);
                var bus = px + ((colW - nodeW) / 2);
                edges.Add(new TreeEdge($"M{Coordinate(px)} {Coordinate(py)}H{Coordinate(bus)}V{Coordinate(y + (nodeH / 2))}H{Coordinate(x)}", BandClass(_bandBelow[i])));
            }

            views.Add(TreeNode(node, x, y, layout.HiddenBelow[i]));
        }

        var drawn = layout.Order.Count;
        var fit = layout.MaxDepth <= FitDepth ? " The drawing is scaled to the page width." : " The drawing scrolls sideways on screen and is scaled to the page when printed.";
        var note = (drawn == layout.EquipmentCount
            ? $"All {Count(layout.EquipmentCount)} nodes of equipment are drawn (the service included); circuits are summarised per panel as a count and their worst total."
            : $"{Count(drawn)} of {Count(layout.EquipmentCount)} nodes of equipment are drawn: whole levels while at most {TreeNodeCap} fit{(layout.DepthLimit == int.MaxValue ? "" : $" (down to depth {layout.DepthLimit})")}, then depth-first order; a node marked \u201c+N\u201d has N more below it, listed in the panel tables. Circuits are summarised per panel.") + fit;
        var width = (margin * 2) + (layout.MaxDepth * colW) + nodeW;
        var height = (margin * 2) + ((layout.Rows - 1) * rowH) + nodeH;
        return new TreeView(layout.MaxDepth <= FitDepth ? "fit" : "scroll", Coordinate(width), Coordinate(height), Coordinate(nodeW), Coordinate(nodeH), Coordinate(nodeW - 10), views, edges, note);
    }

    private TreeNodeView TreeNode(NetworkNode node, double x, double y, int hidden)
    {
        var i = node.Index;
        var worst = double.IsNegativeInfinity(_worstBelow[i]) ? null : Percent(_worstBelow[i]) + " %";
        string line2;
        if (node.Kind == NodeKind.Panelboard && _ownCircuits[i] > 0)
        {
            line2 = $"{Count(_ownCircuits[i])} ccts · worst {worst}";
        }
        else
        {
            line2 = worst is null ? "no circuits below" : $"worst below {worst}";
        }

        string line3;
        if (node.Kind == NodeKind.Service)
        {
            line3 = Escape($"service · {node.System.Name}");
        }
        else if (_incomingRow[i] >= 0)
        {
            var r = _s.Runs[_incomingRow[i]];
            line3 = $"{Conductor(r)} · {Metres(r.LengthM)} m · {Percent(r.DropPercent)} %";
        }
        else
        {
            line3 = "at its source";
        }

        if (node.Kind == NodeKind.Transformer && node.Equipment?.Transformer is { } t)
        {
            var reg = _transformerRow[i] >= 0 ? $" · reg {Percent(_s.Runs[_transformerRow[i]].DropPercent)} %" : "";
            line3 = Escape($"{Limit(t.Kva)} kVA → {t.Secondary.Name}") + reg;
        }

        if (hidden > 0)
        {
            line3 = $"+{Count(hidden)} below, not drawn";
        }

        var id = node.Id.Length > 16 ? node.Id[..15] + "…" : node.Id;
        var kind = node.Kind switch
        {
            NodeKind.Service => "svc",
            NodeKind.Switchboard => "swbd",
            NodeKind.Transformer => "xfmr",
            NodeKind.Splitter => "split",
            _ => "panel",
        };
        var band = _bandBelow[i];
        return new TreeNodeView
        {
            X = Coordinate(x),
            Y = Coordinate(y),
            Kind = kind,
            Id = Escape(id),
            Line2 = line2,
            Line3 = line3,
            Band = BandClass(band),
            Title = Escape($"{node.Id} ({node.Kind.ToString().ToLowerInvariant()}): {BandText(band)}") +
                (worst is null ? "" : $", worst total below {worst}") +
                (_findingsBelow[i] > 0 ? $", {Count(_findingsBelow[i])} findings at or below it" : ""),
            Anchor = _ownCircuits[i] > 0 ? $"#panel-{Count(i)}" : null,
            Flags = _findingsBelow[i] > 0 ? Count(_findingsBelow[i]) : null,
        };
    }

    private PanelView[] BuildPanels()
    {
        var perPanel = new List<int>?[_nodes.Count];
        for (var k = 0; k < _s.EndPoints.Count; k++)
        {
            var panel = _nodes[_s.EndPoints[k].NodeIndex].ParentIndex;
            (perPanel[panel] ??= []).Add(k);
        }

        var panels = new List<PanelView>();
        for (var i = 0; i < _nodes.Count; i++)
        {
            if (perPanel[i] is not { } list)
            {
                continue;
            }

            list.Sort((a, b) =>
            {
                var ea = _s.EndPoints[a];
                var eb = _s.EndPoints[b];
                var byTotal = eb.TotalDropPercent.CompareTo(ea.TotalDropPercent);
                return byTotal != 0 ? byTotal : string.CompareOrdinal(ea.Id, eb.Id);
            });
            var rows = _large ? list.Take(LargeProjectRowsPerPanel).ToList() : list;
            string? more = null;
            if (rows.Count < list.Count)
            {
                var rest = list.Count - rows.Count;
                var withFindings = list.Skip(rows.Count).Count(k => HasAnyFinding(k));
                more = withFindings == 0
                    ? $"{Count(rest)} more, all within limits"
                    : $"{Count(rest)} more, {Count(withFindings)} of them with findings (see Findings)";
            }

            var node = _nodes[i];
            panels.Add(new PanelView
            {
                Anchor = $"panel-{Count(i)}",
                Id = Escape(node.Id),
                System = Escape(node.System.Name),
                From = node.ParentIndex >= 0 ? Escape(_nodes[node.ParentIndex].Id) : "–",
                Circuits = Count(list.Count),
                Worst = Percent(_worstOwn[i]),
                Band = BandClass(_bandOwn[i]),
                Rows = rows.Select(CircuitRowOf).ToArray(),
                More = more,
            });
        }

        return panels.ToArray();
    }

    private bool HasAnyFinding(int endPoint)
    {
        var e = _s.EndPoints[endPoint];
        var row = _incomingRow[e.NodeIndex];
        return e.Findings.Count > 0 || (row >= 0 && _s.Runs[row].Findings.Count > 0);
    }

    private CircuitRow CircuitRowOf(int k)
    {
        var e = _s.EndPoints[k];
        var node = _nodes[e.NodeIndex];
        var row = _incomingRow[e.NodeIndex];
        RunResult? run = row >= 0 ? _s.Runs[row] : null;
        var findings = (run?.Findings ?? []).Concat(e.Findings);
        return new CircuitRow(
            Escape(node.Circuit?.Id ?? e.Id),
            Escape(e.Name),
            OfRun(r => VoltAmperes(r.ApparentPowerVa)),
            OfRun(Conductor),
            OfRun(r => Metres(r.LengthM)),
            OfRun(r => Feet(r.LengthM)),
            OfRun(r => Percent(r.DropPercent)),
            run is { Findings.Count: > 0 },
            Percent(e.TotalDropPercent),
            OtherTotal(e),
            node.Circuit is { Points.Count: > 0 } c ? $"{Count(c.Points.Count)} points" : "",
            node.Circuit is { Points.Count: > 0 } d
                ? $"{Count(d.Points.Count)} loads along the run, the farthest at {Metres(d.Points[^1].AtM)} m; the drop is computed span by span"
                : "",
            BandClass(_endPointBand[k]),
            Codes(findings));

        // A figure of the end point's own run, or a dash where it has none.
        string OfRun(Func<RunResult, string> figure) => run is { } r ? figure(r) : "–";
    }

    // The end point's total by the method not in force (the one in force is TotalDropPercent).
    private string OtherTotal(EndPointResult e) => _s.Project.Rules.Method == SolutionMethod.LoadFlow
        ? Percent(e.PercentSumTotalDropPercent)
        : e.LoadFlowTotalDropPercent is { } flow ? Percent(flow) : "–";

    private static string Tolerance => LoadFlow.TolerancePu.ToString("0e0", System.Globalization.CultureInfo.InvariantCulture);

    private static string MethodName(SolutionMethod method) => method == SolutionMethod.LoadFlow ? "load flow" : "percent sum";

    private static SolutionMethod Other(SolutionMethod method) =>
        method == SolutionMethod.LoadFlow ? SolutionMethod.PercentSum : SolutionMethod.LoadFlow;

    private SectionNumbers Numbers(bool motors)
    {
        var n = 0;
        string Next() => Count(++n);
        string? NextIf(bool shown) => shown ? Next() : null;
        return new SectionNumbers(
            Summary: Next(),
            Comparison: NextIf(_options.Comparison is not null),
            Tree: Next(),
            Worst: Next(),
            Panels: Next(),
            Motors: NextIf(motors),
            Findings: Next(),
            Plan: NextIf(_options.Plan is not null),
            Method: Next());
    }

    private Dictionary<string, string> PanelAnchors()
    {
        var anchors = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var e in _s.EndPoints)
        {
            anchors.TryAdd(e.Id, $"#panel-{Count(_nodes[e.NodeIndex].ParentIndex)}");
        }

        return anchors;
    }

    // Motors, worst terminal dip first (ties by id), as indices into the end points.
    private List<int> MotorIndices()
    {
        var list = new List<int>();
        for (var k = 0; k < _s.EndPoints.Count; k++)
        {
            if (_s.EndPoints[k].MotorStart is not null)
            {
                list.Add(k);
            }
        }

        list.Sort((a, b) =>
        {
            var ea = _s.EndPoints[a];
            var eb = _s.EndPoints[b];
            var byDip = eb.MotorStart!.TerminalDipPercent.CompareTo(ea.MotorStart!.TerminalDipPercent);
            return byDip != 0 ? byDip : string.CompareOrdinal(ea.Id, eb.Id);
        });
        return list;
    }

    private MotorRow MotorRowOf(int k)
    {
        var e = _s.EndPoints[k];
        var m = e.MotorStart!;
        var fails = e.Findings.Any(f => f.Kind == FindingKind.MotorStart);
        return new MotorRow(
            Escape(e.Id),
            Escape(e.Name),
            $"#panel-{Count(_nodes[e.NodeIndex].ParentIndex)}",
            Kva(m.LockedRotorVa),
            Percent(m.TerminalDipPercent),
            Percent(m.PanelDipPercent),
            Limit(m.LimitPercent),
            fails ? "fail" : "pass",
            fails ? "fail" : "pass");
    }

    private static PlanView BuildPlan(Sizing.UpsizePlan plan) => new(
        plan.Changes.Select(c => new PlanRow(
            Escape(c.RunId),
            KindText(c.Kind),
            Escape(c.SizeBefore),
            Escape(c.SizeAfter),
            Count(c.SetsBefore),
            Count(c.SetsAfter),
            Percent(c.DropPercentBefore),
            Percent(c.DropPercentAfter),
            Metres(c.CostAdded),
            Escape(c.GroundingNote ?? ""),
            Escape(Where(c.SizeLocation)))).ToArray(),
        Metres(plan.TotalCostAdded),
        Escape(plan.CostUnit),
        Percent(plan.Before.Summary.WorstTotalDropPercent),
        Percent(plan.After.Summary.WorstTotalDropPercent),
        Count(plan.Before.Summary.Findings),
        Count(plan.After.Summary.Findings),
        plan.After.Summary.WorstEndPoint is { } worstAfter ? Escape(worstAfter) : "–",
        plan.After.HasFindings ? "fail" : "pass",
        plan.After.HasFindings
            ? $"After the plan {Count(plan.After.Summary.Findings)} finding{(plan.After.Summary.Findings == 1 ? " remains" : "s remain")}"
            : "After the plan every run and end point is within its limits",
        plan.Unresolvable.Select(u => new LabelValue(Escape(u.Subject), Escape(u.Message))).ToArray());

    private static RuleMeaning[] Meanings(Rules r) =>
    [
        new("feeder_limit_percent", Limit(r.FeederLimitPercent) + " %", "The largest drop allowed in any one feeder, in percent of the voltage it carries. A run may set its own limit_percent."),
        new("branch_limit_percent", Limit(r.BranchLimitPercent) + " %", "The largest drop allowed in any one branch circuit, in percent of the circuit voltage."),
        new("total_limit_percent", Limit(r.TotalLimitPercent) + " %", "The largest sum of the percent drops from the service (or from a new origin, below) to any point of use."),
        new("branch_current", Escape(RuleText.BranchCurrent(r)), "The current a branch circuit's drop is computed at: connected = the connected load; ocpd_80 = 80 % of the overcurrent device rating; lesser = the smaller of the two."),
        new("conductor_temperature", Escape(RuleText.Temperature(r)), "The temperature of the conductor resistance: estimated = from loading (formula above); rated = the insulation rating; a number = that temperature in °C."),
        new("transformer_drop", Escape(RuleText.TransformerDrop(r)), "count = a transformer's regulation adds to the totals below it; new_origin = its secondary starts a new total budget."),
        new("ambient_c", Limit(r.AmbientC) + " °C", "Ambient temperature for ampacity correction and for the temperature estimate."),
        new("terminal_c", Count(r.TerminalC) + " °C", "Terminal rating: the ampacity column used is at most this temperature."),
        new("method", RuleText.Method(r), "Which figures the findings rest on: percent_sum = the sum of the runs' drops by the effective-impedance formula; load_flow = the backward/forward sweep. Both are computed and shown."),
        new("motor_start_limit_percent", Limit(r.MotorStartLimitPercent) + " %", "The largest dip allowed at a motor's terminals while it starts."),
    ];
}
