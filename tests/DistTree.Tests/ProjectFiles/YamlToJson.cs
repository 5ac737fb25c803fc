using System.Globalization;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// Converts a YAML document to JSON for schema checks, typing plain scalars by the YAML 1.2 core
/// schema (null, booleans, integers, floats); quoted scalars stay strings. Independent of the loader.
/// </summary>
internal static partial class YamlToJson
{
    public static JsonNode? Convert(string yaml)
    {
        var stream = new YamlStream();
        stream.Load(new StringReader(yaml));
        return ConvertNode(stream.Documents[0].RootNode);
    }

    private static JsonNode? ConvertNode(YamlNode node) => node switch
    {
        YamlMappingNode mapping => new JsonObject(mapping.Children.Select(c =>
            KeyValuePair.Create(((YamlScalarNode)c.Key).Value!, ConvertNode(c.Value)))),
        YamlSequenceNode sequence => new JsonArray(sequence.Children.Select(ConvertNode).ToArray()),
        YamlScalarNode scalar => ConvertScalar(scalar),
        _ => throw new NotSupportedException(node.GetType().Name),
    };

    private static JsonValue? ConvertScalar(YamlScalarNode scalar)
    {
        var text = scalar.Value ?? "";
        if (scalar.Style != ScalarStyle.Plain)
        {
            return JsonValue.Create(text);
        }

        if (text is "" or "~" or "null" or "Null" or "NULL")
        {
            return null;
        }

        if (text is "true" or "True" or "TRUE" or "false" or "False" or "FALSE")
        {
            return JsonValue.Create(text.StartsWith('t') || text.StartsWith('T'));
        }

        if (IntPattern().IsMatch(text))
        {
            return JsonValue.Create(long.Parse(text, CultureInfo.InvariantCulture));
        }

        if (FloatPattern().IsMatch(text))
        {
            return JsonValue.Create(double.Parse(text, CultureInfo.InvariantCulture));
        }

        return JsonValue.Create(text);
    }

    [GeneratedRegex(@"^[-+]?[0-9]+$")]
    private static partial Regex IntPattern();

    [GeneratedRegex(@"^[-+]?(\.[0-9]+|[0-9]+(\.[0-9]*)?)([eE][-+]?[0-9]+)?$")]
    private static partial Regex FloatPattern();
}
