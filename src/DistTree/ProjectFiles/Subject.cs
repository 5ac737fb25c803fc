namespace DistTree.ProjectFiles;

/// <summary>
/// What a message is about ("'pf' of the load of circuit 'LP1/3'"), kept in parts and joined only when a
/// message is written: most values are read without an error, so most subjects are never needed as text.
/// </summary>
internal readonly struct Subject
{
    private readonly string? _outer;
    private readonly string? _middle;
    private readonly string? _inner;
    private readonly string _name;

    // A circuit's id: the name then reads "circuit 'PANEL/ID'", with the panel's id in _name.
    private readonly string? _circuit;

    private Subject(string? outer, string? middle, string? inner, string name, string? circuit)
    {
        _outer = outer;
        _middle = middle;
        _inner = inner;
        _name = name;
        _circuit = circuit;
    }

    /// <summary>A subject that is its text.</summary>
    public static implicit operator Subject(string text) => new(null, null, null, text, null);

    /// <summary>"circuit 'PANEL/ID'".</summary>
    public static Subject Circuit(string panel, string id) => new(null, null, null, panel, id);

    /// <summary>This subject with <paramref name="prefix"/> before it: <c>Of("'pf' of ")</c>.</summary>
    public Subject Of(string prefix) => _inner is null
        ? new Subject(prefix, _outer, _middle, _name, _circuit)
        : new Subject(prefix, null, null, ToString(), null);

    /// <summary>The subject's text.</summary>
    public override string ToString() => _circuit is null
        ? string.Concat(_outer, _middle, _inner, _name)
        : string.Concat(string.Concat(_outer, _middle, _inner), "circuit '", _name, "/" + _circuit + "'");
}
