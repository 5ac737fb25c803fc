using System.Globalization;
using DistTree.Model;
using DistTree.ProjectFiles.Yaml;
using DistTree.Vocabulary;

namespace DistTree.ProjectFiles;

/// <summary>The messages about what the sections of a project file say, in the order the file gives its sections.</summary>
internal static partial class ProjectMessages
{
    // "'va', 'kva', 'kw', 'amps', 'hp' or 'fla'": the quantities a load may be given in.
    private static readonly string QuantityList =
        string.Join(", ", Words.LoadQuantity.Words.SkipLast(1).Select(q => $"'{q}'")) + $" or '{Words.LoadQuantity.Words[^1]}'";

    // "'hp' or 'fla'": the quantities a motor is given in.
    private static readonly string MotorQuantityList =
        string.Join(" or ", Words.LoadQuantity.Pairs.Where(p => Load.IsMotorKind(p.Value)).Select(p => $"'{p.Word}'"));

    /// <summary>A root that is not a mapping.</summary>
    public static string NotAProject(SourceNode found) =>
        $"a project file is a mapping of keys (disttree, project, service, equipment); found {found.Describe()}";

    /// <summary>An included file's root that is not a mapping.</summary>
    public static string NotAnIncludedFile(SourceNode found) =>
        $"an included file is a mapping holding 'equipment:' (and 'include:'); found {found.Describe()}";

    /// <summary><c>include</c> that is not a sequence.</summary>
    public static string IncludeNotSequence(SourceNode found) =>
        $"'include' must be a sequence of relative paths ('- buildings/north.yaml'); found {found.Describe()}";

    /// <summary>A <c>supply</c> under a code whose limits do not depend on who supplies the installation.</summary>
    public static string SupplyNotRead(string code) =>
        $"'supply' chooses the limits of a code that sets them by the kind of supply; code '{code}' does not: remove it, or state the limits";

    /// <summary>A format version other than 1.</summary>
    public static string UnsupportedVersion(int version) => $"unsupported format version {version}; this DistTree reads 'disttree: 1'";

    /// <summary>A <c>conductor_temperature</c> that is neither a word nor a number; <paramref name="near"/> is a likely word meant.</summary>
    public static string UnknownTemperature(string text, string? near)
    {
        var hint = near is null ? "" : $"; did you mean '{near}'?";
        var words = string.Join(", ", Words.Temperature.Words.Select(w => $"'{w}'"));
        return $"unknown conductor_temperature '{text}'{hint} (expected {words} or a number in °C)";
    }

    /// <summary><c>prices</c> that is not a mapping.</summary>
    public static string PricesNotMapping(SourceNode found) => $"'prices' must be a mapping of size to price per metre; found {found.Describe()}";

    /// <summary>A size priced twice.</summary>
    public static string PriceTwice(Conductors.ConductorSize size) => $"the price of {size} is given twice";

    /// <summary>
    /// A size written as a bare number: <paramref name="readings"/> are the standard sizes it is in AWG, kcmil and mm2
    /// (none, one or more), and the message asks for the unit.
    /// </summary>
    public static string BareSize(Subject what, string text, IReadOnlyList<Conductors.ConductorSize> readings) => readings.Count == 0
        ? $"{what} is '{text}', which has no unit and is no standard size in AWG, kcmil or mm2: write a size with its unit, e.g. '12 AWG', '250 kcmil' or '95 mm2'"
        : $"{what} is '{text}', which has no unit: write {string.Join(" or ", readings.Select(r => $"'{r.Text}'"))}";

    /// <summary>A sequence of services.</summary>
    public static string ServiceCount(int count) => $"a project has exactly one service (the root of the tree); found {count}";

    /// <summary>A service written as a sequence of one.</summary>
    public static string ServiceIsSequence() => "'service' must be a mapping of keys, not a sequence";


    /// <summary>One of the utility's fault current and X/R without the other.</summary>
    public static string FaultKeyAlone(string given, string missing) =>
        $"'{given}' of the service needs '{missing}' with it: the utility's source is given by its fault current and its X/R ratio together, or by its transformer's kVA, %Z and X/R together";

    /// <summary>A 'trip' that is neither a curve class nor a number.</summary>
    public static string TripUnknown(Subject what, string found) =>
        $"{what} must be a curve class of IEC 60898-1 (B, C or D) or the multiple of the device's rating at which it trips without delay (a number); found '{found}'";

    /// <summary>The utility's source given both by its fault current and by its transformer.</summary>
    public static string SourceGivenTwice(string current, string transformer) =>
        $"'{transformer}' and '{current}' of the service both give the utility's source: keep one (the fault current the utility states, or its transformer's nameplate)";

    /// <summary>An id holding '/', which joins a panel's id and a circuit's.</summary>
    public static string IdWithSlash(string id) => $"the id '{id}' must not contain '/' (it joins a panel's id and a circuit's: LP1/3)";

    /// <summary>
    /// An id holding a character <see cref="Diagnostics.DisplayText"/> escapes (a control character, a line separator, a
    /// direction mark): an id is a reference that other entries and every output repeat, so it must read as it is stored.
    /// </summary>
    public static string IdWithControl(string id) =>
        $"the id '{id}' holds a control character, a line separator or a direction mark (written here as \\uXXXX); an id is a reference that every output repeats, so it holds visible characters only";

    /// <summary><c>equipment</c> that is not a sequence.</summary>
    public static string EquipmentNotSequence(SourceNode found) => $"'equipment' must be a sequence of entries ('- id: ...'); found {found.Describe()}";

    /// <summary>An empty <c>equipment</c> list.</summary>
    public static string EquipmentEmpty() => "'equipment' lists nothing; a project needs at least one piece of equipment";

    /// <summary>An equipment entry that is not a mapping.</summary>
    public static string EquipmentEntryNotMapping(SourceNode found) => $"an equipment entry must be a mapping of keys; found {found.Describe()}";

    /// <summary>A demand factor above 1 (a warning).</summary>
    public static string DemandAboveOne(string name, double demand) =>
        $"the demand factor of '{name}' is {Format(demand)}, above 1: it raises the load it applies to";

    /// <summary>A transformer's key on other equipment.</summary>
    public static string TransformerOnlyKey(string key, string name, EquipmentKind kind) =>
        $"'{key}' applies to transformers only; '{name}' is a {Words.EquipmentKind.Of(kind)}";

    /// <summary>A main rating on a transformer, whose primary terminals are taken as its primary device's.</summary>
    public static string MainOnTransformer(string name) =>
        $"'main_a' is for a switchboard, panelboard or splitter (the rating of its main device or main lugs); transformer '{name}' has neither: its primary terminals are taken as those of its feeder's 'ocpd'";

    /// <summary>A tap between the 2.5 % steps.</summary>
    public static string TapNotAStep(string name, double tap) =>
        $"'tap_percent' of '{name}' is {Format(tap)}; taps come in 2.5 % steps: -5, -2.5, 0, 2.5 or 5";

    /// <summary>A transformer's <c>tap_range_percent</c> that is not 0, 2.5 or 5.</summary>
    public static string TapRangeNotAStep(string name, double range) =>
        $"'tap_range_percent' of '{name}' is {Format(range)}; the upsizer sets taps in 2.5 % steps, so the range is 0, 2.5 or 5";

    /// <summary>A transformer's <c>phase</c> that is not two lines.</summary>
    public static string TransformerPhaseNotTwoLines(string name, string text) =>
        $"'phase' of '{name}' is '{text}'; a single-phase transformer's primary is across two lines: AB, BC or CA";

    /// <summary>A transformer's <c>phase</c> with a three-phase secondary.</summary>
    public static string TransformerPhaseThreePhase(string name, ElectricalSystem secondary) =>
        $"'phase' of '{name}' chooses the two primary lines of a single-phase transformer; its secondary {secondary.Name} is three-phase and takes all three";

    /// <summary>Circuits on a transformer or a splitter.</summary>
    public static string CircuitsNotOnPanel(string panel, EquipmentKind kind) =>
        $"'{panel}' is a {Words.EquipmentKind.Of(kind)}: branch circuits are fed from a panelboard or a switchboard";

    /// <summary><c>circuits</c> that is not a sequence.</summary>
    public static string CircuitsNotSequence(string panel, SourceNode found) =>
        $"'circuits' of '{panel}' must be a sequence of entries ('- id: ...'); found {found.Describe()}";

    /// <summary>A circuit entry that is not a mapping.</summary>
    public static string CircuitEntryNotMapping(SourceNode found) => $"a circuit entry must be a mapping of keys; found {found.Describe()}";

    /// <summary>Two circuits of one panel with one id.</summary>
    public static string DuplicateCircuit(string id, string panel, int firstLine) =>
        $"duplicate circuit id '{id}' in '{panel}' (first given at line {firstLine})";

    /// <summary>A <c>phase</c> that names no lines.</summary>
    public static string NotAPhase(string text) => $"'{text}' is not a phase; expected A, B, C, AB, BC, CA or ABC";

    /// <summary>A circuit with both <c>load</c> and <c>points</c>.</summary>
    public static string LoadAndPoints(Subject circuit) =>
        $"{circuit} gives both 'load' and 'points'; give its load at the end ('load') or along the run ('points')";

    /// <summary>A circuit with neither <c>load</c> nor <c>points</c>.</summary>
    public static string NoLoad(Subject circuit) => $"missing key 'load' in {circuit} (or 'points' for loads along the run)";

    /// <summary><c>ocpd</c> on a circuit and on its run.</summary>
    public static string OcpdTwice(Subject circuit) => $"'ocpd' is given both on {circuit} and on its run; give it once";

    /// <summary>A point farther along than its run is long; lengths in the project's <paramref name="units"/>.</summary>
    public static string PointBeyondRun(Subject circuit, double atM, double lengthM, UnitSystem units) => units switch
    {
        UnitSystem.Metric => $"the farthest point of {circuit} is {Format(atM)} m along a run of {Format(lengthM)} m; a point lies on its run",
        UnitSystem.Imperial => $"the farthest point of {circuit} is {LengthText.Precise(atM, units)} along a run of {LengthText.Precise(lengthM, units)}; a point lies on its run",
    };

    /// <summary><c>points</c> that is not a sequence of one or more.</summary>
    public static string PointsNotSequence(Subject circuit, SourceNode found) =>
        $"'points' of {circuit} must be a sequence of one or more '{{ at: LENGTH, load: {{ ... }} }}'; found {found.Describe()}";

    /// <summary>A motor at a point.</summary>
    public static string PointCarriesMotor(Subject circuit) => $"a point of {circuit} carries a motor; a motor is a circuit of its own";

    /// <summary>Points not listed nearest first.</summary>
    public static string PointsOutOfOrder(Subject circuit) => $"the points of {circuit} must be listed nearest first";

    /// <summary>A load with no quantity.</summary>
    public static string NoQuantity(Subject load) => $"{load} states no quantity; give exactly one of {QuantityList}";

    /// <summary>A load with two quantities.</summary>
    public static string TwoQuantities(Subject load, string first, string second) =>
        $"{load} gives both '{first}' and '{second}'; give exactly one of {QuantityList}";

    /// <summary>A motor load without <c>pf</c>.</summary>
    public static string MotorNeedsPowerFactor(Subject load) => $"missing key 'pf' in {load} (a motor load needs its power factor)";

    /// <summary>A motor-start key on a load that is not a motor.</summary>
    public static string MotorOnlyKey(string key, Subject load) => $"'{key}' in {load} applies to motors only (loads given as {MotorQuantityList})";

    /// <summary>One of air-conditioning equipment's nameplate figures without the other.</summary>
    public static string NameplateNeedsBoth(string given, string missing, Subject load) =>
        $"'{given}' in {load} needs '{missing}' with it (air-conditioning equipment is judged by its nameplate's minimum circuit ampacity and maximum overcurrent device together)";

    /// <summary>A point's load giving air-conditioning nameplate figures.</summary>
    public static string PointCarriesNameplate(Subject circuit) =>
        $"a point of {circuit} gives 'mca' and 'mocp'; air-conditioning equipment is a circuit of its own";

    /// <summary>A locked-rotor code letter not in <paramref name="letters"/>.</summary>
    public static string NotACodeLetter(string text, IEnumerable<string> letters) =>
        $"'{text}' is not a locked-rotor code letter; expected one of {string.Join(", ", letters)}";

    /// <summary>A code letter on a load given in full-load amperes.</summary>
    public static string CodeLetterWithFla(Subject load) =>
        $"a code letter gives kVA per horsepower: {load} needs 'hp' with it, or 'lrc_multiple' with 'fla'";

    /// <summary>Both a code letter and a locked-rotor multiple.</summary>
    public static string CodeLetterAndMultiple(Subject load) => $"{load} gives both 'code_letter' and 'lrc_multiple'; give one";

    /// <summary>A branch run longer than is likely (a warning), <paramref name="lengthM"/> in the project's <paramref name="units"/>.</summary>
    public static string LongBranch(Subject run, double lengthM, UnitSystem units) => units switch
    {
        UnitSystem.Metric => $"{run} is {lengthM.ToString("0.##", CultureInfo.InvariantCulture)} m long, more than 609.6 m (2000 ft); check the length",
        UnitSystem.Imperial => $"{run} is {LengthText.Precise(lengthM, units)} long, more than 2000 ft (609.6 m); check the length",
    };

    /// <summary>A second size of a run (<c>neutral_size</c>, <c>ground_size</c>) of the other series than the lines' size (mm² against AWG or kcmil).</summary>
    public static string SeriesUnlikeLines(string key, Subject run, Conductors.ConductorSize size, Conductors.ConductorSize lines) =>
        $"'{key}' of {run} is {size}, but its 'size' is {lines}: give both in AWG and kcmil, or both in mm2";

    /// <summary>A run that names its raceway and also states the raceway's count of current-carrying conductors.</summary>
    public static string RacewayTwice(Subject run) =>
        $"{run} names a shared raceway ('raceway_id') and states its current-carrying conductors ('current_carrying'): give one (a named raceway counts the conductors of every run in it)";

    /// <summary>An AWG or kcmil size under <c>rules: code: iec</c>, whose current-carrying capacity tables are by mm².</summary>
    public static string SizeNotMetricUnderIec(Subject what, Conductors.ConductorSize size) =>
        $"{what} is {size}, but IEC 60364-5-52's current-carrying capacity tables are by mm2 ('rules: code: iec'): give a metric size (e.g. 2.5 mm2)";

    /// <summary>An <c>installation_method</c> under a code whose ampacity table has no reference methods.</summary>
    public static string InstallationMethodNotUnderCode(Subject run, string code) =>
        $"'installation_method' of {run} chooses a column of IEC 60364-5-52's tables, which 'rules: code: {code}' does not read: remove it, or use 'rules: code: iec'";

    /// <summary>A motor load (<c>hp</c> or <c>fla</c>) whose circuit states a category other than motor or hvac.</summary>
    public static string MotorCategory(Subject circuit, LoadCategory stated) =>
        $"'category' of {circuit} is {Words.LoadCategory.Of(stated)}, but its load is a motor (given in {MotorQuantityList}): a motor's category is {Words.LoadCategory.Of(LoadCategory.Motor)} or {Words.LoadCategory.Of(LoadCategory.Hvac)}";

    /// <summary>A neutral size on the run of a circuit of 2 or 3 poles.</summary>
    public static string NeutralOnLineToLine(Subject circuit, int poles) =>
        $"'neutral_size' of the run of {circuit}: a {poles}-pole circuit has no neutral (only a 1-pole circuit's run has one)";


    /// <summary>What a required key holds, added to the message when it is missing or empty.</summary>
    public static class KeyHints
    {
        /// <summary><c>disttree</c>.</summary>
        public const string FormatVersion = " (the format version: 1)";

        /// <summary><c>equipment</c> of an included file.</summary>
        public const string IncludedEquipment = " (an included file lists equipment)";

        /// <summary><c>system</c> of the service.</summary>
        public const string System = " (e.g. 480Y/277)";

        /// <summary><c>from</c>.</summary>
        public const string From = " (the id of the service or equipment that feeds it)";

        /// <summary><c>kva</c> of a transformer.</summary>
        public const string Kva = " (the rating in kVA)";

        /// <summary><c>secondary</c> of a transformer.</summary>
        public const string Secondary = " (the secondary system, e.g. 208Y/120)";

        /// <summary><c>impedance_percent</c> of a transformer.</summary>
        public const string Impedance = " (the nameplate %Z)";

        /// <summary><c>x_r</c> of a transformer.</summary>
        public const string XOverR = " (the X/R ratio)";

        /// <summary><c>poles</c> of a circuit.</summary>
        public const string Poles = " (1, 2 or 3)";

        /// <summary><c>run</c> of a circuit.</summary>
        public const string Run = " (its length and size)";

        /// <summary><c>at</c> of a point.</summary>
        public const string At = " (its distance along the run)";

        /// <summary><c>size</c> of a run.</summary>
        public const string Size = " (e.g. 12 AWG, 250 kcmil or 95 mm2)";

        /// <summary>
        /// <c>kind</c> of equipment: the kinds, " (switchboard, panelboard, transformer or splitter)".
        /// </summary>
        public static readonly string Kind =
            $" ({string.Join(", ", Words.EquipmentKind.Words.SkipLast(1))} or {Words.EquipmentKind.Words[^1]})";
    }
}
