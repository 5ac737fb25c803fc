using System.Globalization;
using DistTree.ProjectFiles.Yaml;

namespace DistTree.ProjectFiles;

/// <summary>
/// The loader's diagnostic messages, each made by a named factory, so that every text a user reads about a
/// project file is found in one place. This file holds the messages about files, the YAML, keys and values;
/// <c>ProjectMessages.Sections.cs</c> those about what a section says; <c>ProjectMessages.Tree.cs</c> the tree
/// checks' (ids, sources, systems, poles, feed cycles). The bad-file corpus (<c>tests/DistTree.Tests/Cases/bad</c>)
/// pins the texts.
/// </summary>
internal static partial class ProjectMessages
{
    /// <summary>A file above <see cref="ProjectLimits.MaxFileBytes"/>, counted in <paramref name="unit"/> (bytes or characters).</summary>
    public static string TooLarge(long size, string unit) => string.Create(
        CultureInfo.InvariantCulture,
        $"the file has {size:N0} {unit}; a project file may have at most {ProjectLimits.MaxFileBytes:N0} (64 MiB, see docs/limits.md)");

    /// <summary>The main file's bytes do not decode as UTF-8 at <paramref name="offset"/>; <paramref name="hint"/> names a likely encoding.</summary>
    public static string NotUtf8(string hint, byte value, int offset) => string.Create(
        CultureInfo.InvariantCulture,
        $"the file is not UTF-8 text{hint}: the byte 0x{value:X2} at offset {offset:N0} does not decode; save the file as UTF-8");

    /// <summary>A main file with no document, or an empty one.</summary>
    public static string NoProject() => "the file holds no project; it starts with 'disttree: 1' (see docs/project-file.md)";

    /// <summary>An included file with no document, or an empty one.</summary>
    public static string IncludedHoldsNothing() => "the included file holds nothing; it lists 'equipment:' (see docs/project-file.md)";

    /// <summary>A project whose files, included ones too, list no equipment.</summary>
    public static string NoEquipmentWithIncludes() =>
        "the project and the files it includes list no equipment; a project needs at least one piece of equipment";

    /// <summary>The closing diagnostic for the <paramref name="what"/> (errors or warnings) beyond <see cref="ProjectLimits.MaxDiagnostics"/>.</summary>
    public static string More(int count, string what) => string.Create(
        CultureInfo.InvariantCulture,
        $"{count - ProjectLimits.MaxDiagnostics:N0} more {what} from here on not shown (the first {ProjectLimits.MaxDiagnostics:N0} of {count:N0} are)");

    /// <summary>An include path that is empty or absolute.</summary>
    public static string IncludeNotRelative(string path) => $"an include path is relative to the including file ('buildings/north.yaml'); found '{path}'";

    /// <summary>An include path that leaves the main file's folder.</summary>
    public static string IncludeOutside(string path) =>
        $"'{path}' is outside the project's folder; an included file must be in the main file's folder or below it";

    /// <summary>An include whose path stays inside the project's folder but leads, through a symbolic link, outside it.</summary>
    public static string IncludeLinksOutside(string path) =>
        $"'{path}' leads through a symbolic link to outside the project's folder; an included file must be in the main file's folder or below it";

    /// <summary>A file that includes itself, directly or through others; <paramref name="names"/> are the files of the cycle, quoted.</summary>
    public static string IncludeCycle(IEnumerable<string> names) => $"include cycle: {string.Join(" includes ", names)}";

    /// <summary>A file included a second time; <paramref name="first"/> is where it was included first.</summary>
    public static string IncludedTwice(string shown, Diagnostics.SourceLocation first) => $"'{shown}' is included twice (first at {first}); include each file once";

    /// <summary>An included file that cannot be read, and why.</summary>
    public static string CannotReadInclude(string shown, string why) => $"cannot read the included file '{shown}': {why}";

    /// <summary>A data file's path (<paramref name="key"/>: conductor_catalog, grounding_table) that is empty or absolute.</summary>
    public static string DataFileNotRelative(string key, string path) =>
        $"'{key}' is a path relative to the project file ('tables/{key}.tsv'); found '{path}'";

    /// <summary>A data file's path that leaves the project's folder, as written or through a symbolic link.</summary>
    public static string DataFileOutside(string key, string path) =>
        $"'{path}' is outside the project's folder (as written or through a symbolic link); the file '{key}' names must be in the project file's folder or below it";

    /// <summary>A data file that cannot be read, and why.</summary>
    public static string CannotReadDataFile(string key, string shown, string why) => $"cannot read the file '{key}' names, '{shown}': {why}";

    /// <summary>A data file over <see cref="ProjectLimits.MaxFileBytes"/>.</summary>
    public static string DataFileTooLarge(string shown, long size) => string.Create(
        CultureInfo.InvariantCulture,
        $"the file '{shown}' has {size:N0} bytes; a file a project reads may have at most {ProjectLimits.MaxFileBytes:N0} (64 MiB, see docs/limits.md)");

    /// <summary>Why a folder named as a file cannot be read.</summary>
    public static string IsAFolder() => "it is a folder, not a file";

    /// <summary>Why a device, a pipe or a socket named as a file is not read.</summary>
    public static string NotARegularFile() => "it is not a regular file (a device or a pipe?); a project file is read from a regular file";

    /// <summary>An included file over <see cref="ProjectLimits.MaxFileBytes"/>.</summary>
    public static string IncludeTooLarge(string shown, long size) => string.Create(
        CultureInfo.InvariantCulture,
        $"the included file '{shown}' has {size:N0} bytes; a project file may have at most {ProjectLimits.MaxFileBytes:N0} (64 MiB, see docs/limits.md)");

    /// <summary>A second YAML document in one file.</summary>
    public static string SecondDocument() => "a project file holds one YAML document; a second one starts here";

    /// <summary>Nesting deeper than <see cref="ProjectLimits.MaxDepth"/>.</summary>
    public static string TooDeep() =>
        $"the YAML nests deeper than {ProjectLimits.MaxDepth} levels here; a project needs at most 6 (see docs/limits.md)";

    /// <summary>A YAML alias, <c>*name</c>.</summary>
    public static string AliasNotSupported(string alias) =>
        $"aliases ('*{alias}') are not supported; write the value out (each run's size is edited in place)";

    /// <summary>A tab where YAML wants spaces.</summary>
    public static string TabIndent() => "a tab in the indentation; YAML indents with spaces only";

    /// <summary>YamlDotNet's own message, its position prefix taken off (<paramref name="detail"/> may be empty).</summary>
    public static string InvalidYaml(string detail) =>
        detail.Length == 0 ? "the YAML cannot be read here" : "invalid YAML: " + char.ToLowerInvariant(detail[0]) + detail[1..];

    /// <summary>A "\U" escape whose code is no Unicode character (0x80000000 or more), in YamlDotNet's own words for the smaller ones.</summary>
    public static string InvalidEscape() => InvalidYaml("while scanning a quoted scalar, found invalid Unicode character escape code.");

    /// <summary>YamlDotNet stopped without a position of its own.</summary>
    public static string UnclosedFlow() => "invalid YAML after this point: an unclosed '[', '{' or quote?";

    /// <summary>A scalar longer than <see cref="ProjectLimits.MaxScalarLength"/>.</summary>
    public static string ScalarTooLong(int length) => string.Create(
        CultureInfo.InvariantCulture,
        $"a value of {length:N0} characters; a value may have at most {ProjectLimits.MaxScalarLength:N0} (see docs/limits.md)");

    /// <summary>An id longer than <see cref="ProjectLimits.MaxIdLength"/>.</summary>
    public static string IdTooLong(Subject what, int length) => string.Create(
        CultureInfo.InvariantCulture,
        $"{what} has {length:N0} characters; an id may have at most {ProjectLimits.MaxIdLength:N0} (see docs/limits.md)");

    /// <summary>A YAML tag other than the string tag.</summary>
    public static string TagNotSupported(string tag) => $"the tag '{tag}' is not supported; write the value without a tag";

    /// <summary>A mapping key that is a collection.</summary>
    public static string KeyNotPlain(SourceNode found) => $"a key must be a plain word, not {found.Describe()}";

    /// <summary>A key the mapping may not hold; <paramref name="hint"/> is a "did you mean" or the list of keys.</summary>
    public static string UnknownKey(string key, Subject context, string hint) => $"unknown key '{key}' in {context}{hint}";

    /// <summary>A key given twice in one mapping.</summary>
    public static string DuplicateKey(string key, Subject context, int firstLine) => $"duplicate key '{key}' in {context} (first given at line {firstLine})";

    /// <summary>A required key not given; <paramref name="hint"/> says what it holds.</summary>
    public static string MissingKey(string key, Subject context, string hint) => $"missing key '{key}' in {context}{hint}";

    /// <summary>A required key given with no value.</summary>
    public static string NoValue(string key, Subject context, string hint) => $"'{key}' in {context} has no value{hint}";

    /// <summary>A value where a mapping belongs.</summary>
    public static string NotAMapping(Subject what, SourceNode found) => $"{what} must be a mapping of keys; found {found.Describe()}";

    /// <summary>Not a number; <paramref name="hint"/> notes a quoted number.</summary>
    public static string NotANumber(Subject what, SourceNode found, string hint) => $"{what} must be a number; found {found.Describe()}{hint}";

    /// <summary>A length of zero or less, or over 100 km, as written.</summary>
    public static string LengthOutOfRange(Subject what, string written) =>
        $"{what} must be {ValueRanges.LengthM} ({NumberRange.Text(ValueRanges.MaxLengthFt)} ft); found {written}";

    /// <summary>A number outside its key's range (<see cref="ValueRanges"/>), as written.</summary>
    public static string OutOfRange(Subject what, NumberRange range, string written) => $"{what} must be {range}; found {written}";

    /// <summary>A fraction where a whole number belongs.</summary>
    public static string NotWhole(Subject what, double value) => $"{what} must be a whole number; found {Format(value)}";

    /// <summary>A whole number not among the few allowed.</summary>
    public static string NotOneOf(Subject what, IReadOnlyList<int> allowed, int value)
    {
        var words = allowed.Select(a => a.ToString(CultureInfo.InvariantCulture)).ToArray();
        return $"{what} must be {string.Join(", ", words[..^1])} or {words[^1]}; found {value}";
    }

    /// <summary>Not <c>true</c> or <c>false</c>.</summary>
    public static string NotBool(Subject what, SourceNode found) => $"{what} must be true or false; found {found.Describe()}";

    /// <summary>Text of blanks only.</summary>
    public static string EmptyText(Subject what) => $"{what} must not be empty";

    /// <summary>Not text (nothing, a collection or a boolean).</summary>
    public static string NotText(Subject what, SourceNode found) => $"{what} must be text; found {found.Describe()}";

    /// <summary>A word not in the list of <paramref name="noun"/>; <paramref name="hint"/> is a "did you mean" or the list.</summary>
    public static string UnknownWord(string noun, string text, string hint) => $"unknown {noun} '{text}'{hint}";

    /// <summary>A number not finite (<c>.inf</c>, <c>.nan</c>, or too large).</summary>
    public static string NotFinite(Subject what, string text) => $"{what} must be a finite number; found '{text}'";

    /// <summary>Not a length at all.</summary>
    public static string NotALength(Subject what, SourceNode found) =>
        $"{what} must be a length (a number, or a number with m or ft); found {found.Describe()}";

    /// <summary>Text that does not read as a number with a unit.</summary>
    public static string LengthUnreadable(Subject what, string written) =>
        $"{what} is '{written}', which is not a length; expected a number (in the project's unit) or a number with its unit, e.g. '28 m' or '92 ft'";

    /// <summary>A length whose number is not finite.</summary>
    public static string LengthNotFinite(Subject what, string written) => $"{what} is '{written}', which is not a finite number";

    /// <summary>A length with a unit other than m or ft.</summary>
    public static string NotALengthUnit(Subject what, string written, string unit) =>
        $"{what} is '{written}', whose unit '{unit}' is not a unit of length; use m or ft";

    /// <summary>A number as a message writes it: shortest round-trip text, invariant culture.</summary>
    private static string Format(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
