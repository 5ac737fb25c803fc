using System.Globalization;
using DistTree.Diagnostics;

namespace DistTree.Solving;

/// <summary>What limit a finding reports.</summary>
public enum FindingKind
{
    /// <summary>A feeder's drop is over its limit.</summary>
    FeederDrop,

    /// <summary>A branch circuit's drop is over its limit.</summary>
    BranchDrop,

    /// <summary>An end point's total drop from the service (or a new origin) is over the total limit.</summary>
    TotalDrop,

    /// <summary>The design current (125 % of continuous load plus the rest) exceeds the allowable ampacity.</summary>
    Ampacity,

    /// <summary>The overcurrent device is rated above what the conductors' ampacity permits.</summary>
    OcpdAboveAmpacity,

    /// <summary>A transformer is loaded above its rating.</summary>
    TransformerOverload,

    /// <summary>A motor's terminals dip more than the limit while it starts.</summary>
    MotorStart,

    /// <summary>A neutral's current exceeds its allowable ampacity.</summary>
    NeutralAmpacity,

    /// <summary>The design current exceeds the overcurrent device's rating.</summary>
    DeviceBelowLoad,

    /// <summary>A stated equipment grounding conductor is smaller than the run needs.</summary>
    GroundingConductor,

    /// <summary>Equipment's stated interrupting or short-circuit current rating is below the fault current available at it.</summary>
    InterruptingRating,

    /// <summary>A fault at a run's far end draws less current than trips its device without delay.</summary>
    FaultClearing,

    /// <summary>A transformer's stated raising tap puts its secondary more than the light-load limit above nominal at no load.</summary>
    NoLoadRise,
}

/// <summary>
/// A limit exceeded, with the figures that prove it. Its sentence follows from them: a finding the solver makes
/// writes it when it is first read (as a view works out a figure), so a solve writes no text that nothing reads.
/// Two findings are equal when their figures, sentences and locations are.
/// </summary>
public sealed record Finding
{
    // The sentence, once written; until then, what writes it (in the invariant culture).
    private readonly FormattableString? _text;
    private string? _message;

    /// <summary>A finding with its sentence.</summary>
    /// <param name="kind">Which limit.</param>
    /// <param name="reference">The clause of the code in force the limit comes from (see <c>CodeRules.Cite</c>).</param>
    /// <param name="subject">The id of the run or end point.</param>
    /// <param name="value">The figure found (percent, amperes or kVA as the kind says).</param>
    /// <param name="limit">The limit it exceeds, in the same unit.</param>
    /// <param name="message">One sentence with the figures, for people.</param>
    /// <param name="location">Where the run or circuit is in the project file.</param>
    public Finding(FindingKind kind, string reference, string subject, double value, double limit, string message, SourceLocation location)
        : this(kind, reference, subject, value, limit, location) => _message = message;

    private Finding(FindingKind kind, string reference, string subject, double value, double limit, FormattableString text, SourceLocation location)
        : this(kind, reference, subject, value, limit, location) => _text = text;

    private Finding(FindingKind kind, string reference, string subject, double value, double limit, SourceLocation location)
    {
        Kind = kind;
        Reference = reference;
        Subject = subject;
        Value = value;
        Limit = limit;
        Location = location;
    }

    /// <summary>Which limit.</summary>
    public FindingKind Kind { get; }

    /// <summary>The clause of the code in force the limit comes from, e.g. <c>NEC 215.2(A)(1)</c>.</summary>
    public string Reference { get; }

    /// <summary>The id of the run or end point.</summary>
    public string Subject { get; }

    /// <summary>The figure found (percent, amperes or kVA as the kind says).</summary>
    public double Value { get; }

    /// <summary>The limit it exceeds, in the same unit.</summary>
    public double Limit { get; }

    /// <summary>One sentence with the figures, for people.</summary>
    public string Message => _message ??= _text!.ToString(CultureInfo.InvariantCulture);

    /// <summary>Where the run or circuit is in the project file.</summary>
    public SourceLocation Location { get; }

    /// <summary>The kind as written in JSON and reports: <c>feeder_drop</c>, <c>branch_drop</c>, …</summary>
    public string Code => FindingKinds.Of(Kind).Code;

    /// <summary>A finding whose sentence <paramref name="text"/> is written, in the invariant culture, when it is first read.</summary>
    internal static Finding Written(FindingKind kind, string reference, string subject, double value, double limit, FormattableString text, SourceLocation location) =>
        new(kind, reference, subject, value, limit, text, location);

    /// <inheritdoc/>
    public bool Equals(Finding? other) =>
        other is not null && Kind == other.Kind && Reference == other.Reference && Subject == other.Subject && Value.Equals(other.Value) && Limit.Equals(other.Limit)
        && Message == other.Message && Location.Equals(other.Location);

    /// <inheritdoc/>
    public override int GetHashCode() => HashCode.Combine(Kind, Reference, Subject, Value, Limit, Message, Location);
}
