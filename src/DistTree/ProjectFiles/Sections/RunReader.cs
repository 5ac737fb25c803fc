using DistTree.Conductors;
using DistTree.Diagnostics;
using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// Reads a feeder's or a branch circuit's run: its length, size, neutral size, grounding conductor's size, sets, conductor, device, limit and
/// whether it is fixed.
/// </summary>
internal sealed class RunReader(SectionContext context)
{
    /// <summary>Branch runs longer than this are probably a typo (2000 ft, common practice as a sanity bound).</summary>
    public const double LongBranchM = 2000 * UnitFactors.MetresPerFoot;

    // Each size text parsed, with its result: a file names a few sizes many times.
    // Each size text read, parsed once. The value is a class: a dictionary of a reference type runs the base library's
    // precompiled shared code, where a tuple's would be compiled at start (DEVELOPERS.md, Start-up).
    private readonly Dictionary<string, ParsedSize> _sizes = new(StringComparer.Ordinal);

    private DiagnosticBag Bag => context.Bag;

    private ValueReader Values => context.Values;

    /// <summary>
    /// Reads a feeder or branch run. <paramref name="circuitOcpdA"/> (the circuit's own 'ocpd') becomes the run's
    /// device when the run states none; <paramref name="ocpdLocation"/> is set when the run states one, and
    /// <paramref name="neutralLocation"/> (the key's place) when it states a neutral size, which only the caller
    /// can tell is allowed (a 1-pole branch circuit, a feeder whose system has a neutral).
    /// </summary>
    public Run? Read(SourceNode node, Subject subject, bool branch, out SourceLocation? ocpdLocation, out SourceLocation? neutralLocation, double? circuitOcpdA = null)
    {
        ocpdLocation = null;
        neutralLocation = null;
        if (context.Map(node, subject, subject, ProjectKeys.Run) is not { } m)
        {
            return null;
        }

        var lengthNode = m.Required("length");
        var length = lengthNode is null ? null : Values.LengthM(lengthNode, subject.Of("'length' of "), context.Draft.Units);
        if (branch && length > LongBranchM)
        {
            Bag.Warning(lengthNode!.Location, ProjectMessages.LongBranch(subject, length.Value, context.Draft.Units));
        }

        var sizeNode = m.Required("size", ProjectMessages.KeyHints.Size);
        var size = sizeNode is null ? null : Size(sizeNode, subject.Of("'size' of "));
        var neutralNode = m.Optional("neutral_size");
        var neutral = neutralNode is null ? null : SizeBesideLines(neutralNode, "neutral_size", subject, size);
        if (neutralNode is not null)
        {
            neutralLocation = m.KeyLocation("neutral_size");
        }

        var groundNode = m.Optional("ground_size");
        var ground = groundNode is null ? null : SizeBesideLines(groundNode, "ground_size", subject, size);
        var sets = Sets(m, subject);
        var defaults = context.Draft.Defaults;
        var material = m.Optional("material") is { } materialNode ? Values.Choice(materialNode, subject.Of("'material' of "), "material", Words.Material.Pairs) : defaults.Material;
        var insulation = m.Optional("insulation_c") is { } insulationNode ? Values.IntegerOf(insulationNode, subject.Of("'insulation_c' of "), SectionContext.TemperatureRatings) : defaults.InsulationC;
        var raceway = m.Optional("raceway") is { } racewayNode ? Values.Choice(racewayNode, subject.Of("'raceway' of "), "raceway", Words.Raceway.Pairs) : defaults.Raceway;
        var (racewayId, currentCarrying, sharingOk) = Sharing(m, subject);
        double? ocpd = null;
        if (m.Optional("ocpd") is { } ocpdNode)
        {
            ocpd = Values.InRange(ocpdNode, subject.Of("'ocpd' of "), ValueRanges.OcpdA);
            ocpdLocation = m.KeyLocation("ocpd");
        }

        var (deviceType, method, installationOk) = Installation(m, subject);
        var (trip, tripOk) = Trip(m, subject);
        var limit = m.Optional("limit_percent") is { } limitNode ? Values.InRange(limitNode, subject.Of("'limit_percent' of "), ValueRanges.LimitPercent) : null;
        var isFixed = m.Optional("fixed") is { } fixedNode && (Values.Bool(fixedNode, subject.Of("'fixed' of ")) ?? false);
        var ratedContinuous = m.Optional("device_rated_continuous") is { } ratedNode && (Values.Bool(ratedNode, subject.Of("'device_rated_continuous' of ")) ?? false);
        if (!sharingOk || !installationOk || !tripOk || length is null || size is null || (neutralNode is not null && neutral is null) || (groundNode is not null && ground is null) || sets < 1 || material is null || insulation is null || raceway is null
            || (m.Optional("ocpd") is not null && ocpd is null) || (m.Optional("limit_percent") is not null && limit is null))
        {
            return null;
        }

        return new Run
        {
            LengthM = length.Value,
            Size = size.Value,
            NeutralSize = neutral,
            GroundSize = ground,
            Sets = sets,
            Material = material.Value,
            InsulationC = insulation.Value,
            Raceway = raceway.Value,
            RacewayId = racewayId,
            CurrentCarrying = currentCarrying,
            OcpdA = ocpd ?? circuitOcpdA,
            DeviceType = deviceType,
            Trip = trip,
            InstallationMethod = method,
            LimitPercent = limit,
            Fixed = isFixed,
            DeviceRatedContinuous = ratedContinuous,
            Location = m.Node.Location,
            SizeLocation = sizeNode!.Location,
        };
    }

    // What the run shares its raceway with: a raceway's name, or a count of the current-carrying conductors in it, not
    // both (the count of a named raceway is the sum of its runs'). Ok is false where a value was refused.
    private (string? RacewayId, int? CurrentCarrying, bool Ok) Sharing(in MappingReader m, Subject subject)
    {
        var idNode = m.Optional("raceway_id");
        var countNode = m.Optional("current_carrying");
        var id = idNode is null ? null : context.Id(idNode, subject.Of("'raceway_id' of ").ToString());
        var count = countNode is null ? null : Values.WholeInRange(countNode, subject.Of("'current_carrying' of "), ValueRanges.CurrentCarrying);
        if (idNode is not null && countNode is not null)
        {
            Bag.Error(m.KeyLocation("current_carrying"), ProjectMessages.RacewayTwice(subject));
            return (null, null, false);
        }

        return (id, count, (idNode is null || id is not null) && (countNode is null || count is not null));
    }

    // How fast the device trips on a large fault ('trip'): a curve class of IEC 60898-1 (B, C, D) or a number, the multiple
    // of the rating at which a breaker trips without delay. A fuse takes a stated multiple only (its clearing current is
    // read from its own curve). Ok is false where the value was refused.
    private (TripSetting? Trip, bool Ok) Trip(in MappingReader m, Subject subject)
    {
        if (m.Optional("trip") is not { } node)
        {
            return (null, true);
        }

        var what = subject.Of("'trip' of ");
        if (node is SourceScalar { IsPlain: true } scalar && ValueReader.IsNumberText(scalar.Value))
        {
            return Values.InRange(node, what, ValueRanges.TripMultiple) is { } multiple ? (TripSetting.Stated(multiple), true) : (null, false);
        }

        if (Values.Text(node, what) is not { } text)
        {
            return (null, false);
        }

        foreach (var (word, value) in TripSetting.Classes)
        {
            if (string.Equals(word, text, StringComparison.Ordinal))
            {
                return (value, true);
            }
        }

        Bag.Error(node.Location, ProjectMessages.TripUnknown(what, text));
        return (null, false);
    }

    // The device's kind ('device_type', any code) and the reference method of installation ('installation_method', read
    // by IEC 60364-5-52's tables only: refused under another code, whose table would silently ignore it). Ok is false
    // where a value was refused.
    private (DeviceType Device, InstallationMethod Method, bool Ok) Installation(in MappingReader m, Subject subject)
    {
        var ok = true;
        var device = DeviceType.Breaker;
        if (m.Optional("device_type") is { } deviceNode)
        {
            var read = Values.Choice(deviceNode, subject.Of("'device_type' of "), "device_type", Words.DeviceType.Pairs);
            ok = read is not null;
            device = read ?? device;
        }

        var method = InstallationMethod.B1;
        if (m.Optional("installation_method") is { } methodNode)
        {
            var read = Values.Choice(methodNode, subject.Of("'installation_method' of "), "installation_method", Words.InstallationMethod.Pairs);
            var code = context.Draft.Rules.Code;
            if (read is not null && code != ElectricalCode.Iec)
            {
                Bag.Error(m.KeyLocation("installation_method"), ProjectMessages.InstallationMethodNotUnderCode(subject, Words.Code.Of(code)));
                read = null;
            }

            ok &= read is not null;
            method = read ?? method;
        }

        return (device, method, ok);
    }

    // A second size of the run ('neutral_size', 'ground_size'): read as the size is, and in the same series (AWG and
    // kcmil, or mm²) as the lines.
    private ConductorSize? SizeBesideLines(SourceNode node, string key, Subject subject, ConductorSize? lines)
    {
        var size = Size(node, subject.Of($"'{key}' of "));
        if (size is { } s && lines is { } l && s.Series != l.Series)
        {
            Bag.Error(node.Location, ProjectMessages.SeriesUnlikeLines(key, subject, s, l));
            return null;
        }

        return size;
    }

    // A conductor size, parsed once per distinct text; 'what' names the key in messages. A bare number is refused
    // with its readings (SizeText), a message naming the key, so it is not kept with the texts parsed.
    private ConductorSize? Size(SourceNode node, Subject what)
    {
        if (Values.Text(node, what) is not { } text)
        {
            return null;
        }

        if (SizeText.BareNumberError(text, what) is { } bare)
        {
            Bag.Error(node.Location, bare);
            return null;
        }

        if (!_sizes.TryGetValue(text, out var parsed))
        {
            var ok = ConductorSize.TryParse(text, out var size, out var error);
            parsed = new ParsedSize(ok, size, error);
            _sizes.Add(text, parsed);
        }

        if (parsed.Ok && parsed.Size.Kind != SizeKind.Metric && context.Draft.Rules.Code == ElectricalCode.Iec)
        {
            Bag.Error(node.Location, ProjectMessages.SizeNotMetricUnderIec(what, parsed.Size));
            return null;
        }

        if (parsed.Ok)
        {
            return parsed.Size;
        }

        Bag.Error(node.Location, parsed.Error);
        return null;
    }

    // The parallel sets: 1 unless stated; out of range is reported (0 then, and the run not made).
    private int Sets(in MappingReader m, Subject subject) =>
        m.Optional("sets") is { } setsNode ? Values.WholeInRange(setsNode, subject.Of("'sets' of "), ValueRanges.Sets) ?? 0 : 1;

    private sealed record ParsedSize(bool Ok, ConductorSize Size, string Error);
}
