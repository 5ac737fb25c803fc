using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles.Sections;

/// <summary>
/// Reads a <c>load</c>: exactly one quantity (its word from <see cref="Words.LoadQuantity"/>), the power factor, the
/// load model, a motor's starting data, and air-conditioning equipment's nameplate <c>mca</c> and <c>mocp</c>.
/// </summary>
internal sealed class LoadReader(SectionContext context)
{
    // NEMA locked-rotor code letters (NEC Table 430.7(B)); I, O and Q are not used.
    private static readonly string[] CodeLetters =
        ["A", "B", "C", "D", "E", "F", "G", "H", "J", "K", "L", "M", "N", "P", "R", "S", "T", "U", "V"];

    // "'va' of ", "'kva' of " ...: the start of the subject of a message about a load's quantity, by its position in Words.LoadQuantity.
    private static readonly string[] QuantityPrefixes = [.. Words.LoadQuantity.Words.Select(q => $"'{q}' of ")];

    private DiagnosticBag Bag => context.Bag;

    private ValueReader Values => context.Values;

    /// <summary>The load <paramref name="node"/> states, or null when it cannot be read (reported).</summary>
    public Load? Read(SourceNode node, Subject subject)
    {
        if (context.Map(node, subject, subject, ProjectKeys.Load) is not { } m || Quantity(m, subject) is not { } quantity)
        {
            return null;
        }

        var kind = Words.LoadQuantity.Pairs[quantity].Value;
        var motor = Load.IsMotorKind(kind);
        var value = m.Required(Words.LoadQuantity.Words[quantity]) is { } valueNode ? Values.InRange(valueNode, subject.Of(QuantityPrefixes[quantity]), ValueRanges.Of(kind)) : null;
        double? pf = 1.0;
        if (m.Optional("pf") is { } pfNode)
        {
            pf = Values.InRange(pfNode, subject.Of("'pf' of "), ValueRanges.PowerFactor);
        }
        else if (motor)
        {
            Bag.Error(m.Node.Location, ProjectMessages.MotorNeedsPowerFactor(subject));
            pf = null;
        }

        var model = LoadModel.ConstantPower;
        if (m.Optional("model") is { } modelNode && Values.Choice(modelNode, "'model'", "load model", Words.LoadModel.Pairs) is { } chosen)
        {
            model = chosen;
        }

        var start = ReadMotorStart(m, subject, motor, out var startOk);
        var (mca, mocp, nameplateOk) = ReadNameplate(m, subject);
        return value is not null && pf is not null && startOk && nameplateOk
            ? new Load(kind, value.Value, pf.Value) { Model = model, Start = start, MinimumCircuitA = mca, MaximumDeviceA = mocp }
            : null;
    }

    // Air-conditioning equipment's nameplate minimum circuit ampacity and maximum overcurrent device: both or neither.
    private (double? Mca, double? Mocp, bool Ok) ReadNameplate(in MappingReader m, Subject subject)
    {
        var (mcaNode, mocpNode) = (m.Optional("mca"), m.Optional("mocp"));
        if (mcaNode is null && mocpNode is null)
        {
            return (null, null, true);
        }

        var mca = mcaNode is null ? null : Values.InRange(mcaNode, subject.Of("'mca' of "), ValueRanges.MinimumCircuitAmpacity);
        var mocp = mocpNode is null ? null : Values.InRange(mocpNode, subject.Of("'mocp' of "), ValueRanges.MaximumOvercurrentDevice);
        if (mcaNode is null || mocpNode is null)
        {
            var (given, missing) = mcaNode is null ? ("mocp", "mca") : ("mca", "mocp");
            Bag.Error(m.KeyLocation(given), ProjectMessages.NameplateNeedsBoth(given, missing, subject));
            return (null, null, false);
        }

        return (mca, mocp, mca is not null && mocp is not null);
    }

    // The position in Words.LoadQuantity of the one quantity given; null (reported) when none or two are.
    private int? Quantity(in MappingReader m, Subject subject)
    {
        // The first two different quantities given, in file order.
        SourceScalar? first = null;
        SourceScalar? second = null;
        foreach (var entry in m.Node.Entries)
        {
            var key = entry.Key;
            if (!Words.LoadQuantity.TryRead(key.Value, out _))
            {
                continue;
            }

            if (first is null)
            {
                first = key;
            }
            else if (!string.Equals(key.Value, first.Value, StringComparison.Ordinal))
            {
                second = key;
                break;
            }
        }

        if (first is null)
        {
            Bag.Error(m.Node.Location, ProjectMessages.NoQuantity(subject));
            return null;
        }

        if (second is not null)
        {
            Bag.Error(second.Location, ProjectMessages.TwoQuantities(subject, first.Value, second.Value));
            return null;
        }

        return Words.LoadQuantity.IndexOf(first.Value);
    }

    // A motor's starting data (code letter or locked-rotor multiple, starting power factor); null when none is given.
    private MotorStart? ReadMotorStart(in MappingReader m, Subject subject, bool motor, out bool ok)
    {
        ok = true;
        var given = false;
        foreach (var key in ProjectKeys.MotorStart)
        {
            if (!m.Has(key))
            {
                continue;
            }

            given = true;
            if (!motor)
            {
                Bag.Error(m.KeyLocation(key), ProjectMessages.MotorOnlyKey(key, subject));
                ok = false;
            }
        }

        if (!motor || !given)
        {
            return null;
        }

        var letter = CodeLetter(m, subject, ref ok);
        var multiple = LockedRotorMultiple(m, subject, letter, ref ok);
        var startingPf = MotorStart.DefaultPowerFactor;
        if (m.Optional("starting_pf") is { } spfNode)
        {
            if (Values.InRange(spfNode, subject.Of("'starting_pf' of "), ValueRanges.PowerFactor) is { } spf)
            {
                startingPf = spf;
            }
            else
            {
                ok = false;
            }
        }

        return new MotorStart(letter, multiple, startingPf);
    }

    private string? CodeLetter(in MappingReader m, Subject subject, ref bool ok)
    {
        string? letter = null;
        if (m.Optional("code_letter") is { } letterNode && Values.Text(letterNode, subject.Of("'code_letter' of ")) is { } text)
        {
            letter = text.ToUpperInvariant();
            if (!CodeLetters.Contains(letter, StringComparer.Ordinal))
            {
                Bag.Error(letterNode.Location, ProjectMessages.NotACodeLetter(text, CodeLetters));
                ok = false;
            }
        }

        if (letter is not null && m.Has("fla"))
        {
            Bag.Error(m.KeyLocation("code_letter"), ProjectMessages.CodeLetterWithFla(subject));
            ok = false;
        }

        return letter;
    }

    private double? LockedRotorMultiple(in MappingReader m, Subject subject, string? letter, ref bool ok)
    {
        double? multiple = null;
        if (m.Optional("lrc_multiple") is { } multipleNode)
        {
            multiple = Values.InRange(multipleNode, subject.Of("'lrc_multiple' of "), ValueRanges.LockedRotorMultiple);
            if (multiple is null)
            {
                ok = false;
            }

            if (letter is not null)
            {
                Bag.Error(multipleNode.Location, ProjectMessages.CodeLetterAndMultiple(subject));
                ok = false;
            }
        }

        return multiple;
    }
}
