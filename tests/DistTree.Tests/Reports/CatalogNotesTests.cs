using DistTree.Conductors;
using DistTree.Reports.Html;

namespace DistTree.Tests.Reports;

/// <summary>
/// The report says once which conductor data are recalled rather than read (issue 22), from the catalogue's own notes.
/// The expected columns are those the embedded catalogue's header marks "memory" (src/DistTree/Conductors/Data/conductors.tsv).
/// </summary>
public sealed class CatalogNotesTests
{
    [Fact]
    public void Recalled_EmbeddedCatalogue_NamesEachColumnWithRecalledValuesAndNoOther()
    {
        var recalled = CatalogNotes.Recalled(ConductorCatalog.Standard.Header);

        Assert.Equal(["x_pvc", "x_steel", "ral_cu", "ral_al", "r20_cu", "r20_al", "cu60..cu90", "al60..al90", "ins_mm"], recalled.Select(r => r.Column));
        Assert.Equal("recalled for 14, 3, 1 AWG, 3/0, 300, 400, 600 kcmil", recalled[0].What);
        Assert.Equal("as x_pvc", recalled[1].What);
        Assert.DoesNotContain(recalled, r => r.What.Contains("memory", StringComparison.Ordinal));
    }

    [Fact]
    public void Recalled_NoMemoryMark_NothingListed()
    {
        string[] header = ["A catalogue of our own.", "", "column      unit   source", "size        -      canonical size text", "cu75        A      NEC Table 310.16 (read)"];

        Assert.Empty(CatalogNotes.Recalled(header));
    }

    [Fact]
    public void Render_Demo_SaysOnceWhatIsRecalledAndKeepsTheNotesFolded()
    {
        var doc = ReportFixtures.RenderDemo();

        var items = doc.QuerySelectorAll("ul.recalled li").Select(li => li.TextContent).ToArray();
        Assert.Contains("x_pvc: recalled for 14, 3, 1 AWG, 3/0, 300, 400, 600 kcmil", items);
        var notes = Assert.Single(doc.QuerySelectorAll("details.sources pre.sources"));
        Assert.Contains("memory = recalled", notes.TextContent, StringComparison.Ordinal);
        Assert.DoesNotContain(doc.QuerySelectorAll("pre.sources"), p => p.ParentElement?.LocalName != "details" && p.TextContent.Contains("memory = recalled", StringComparison.Ordinal));
    }
}
