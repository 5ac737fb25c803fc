using DistTree.Model;
using DistTree.Solving;

namespace DistTree.Tests.Solving.Reference;

/// <summary>Analyses project text, optionally edited in the model first (for what the project file cannot say yet).</summary>
internal static class ReferenceHarness
{
    /// <summary>Parses and solves <paramref name="yaml"/>; with <paramref name="edit"/>, solves the edited project instead.</summary>
    public static AnalysisResult Analyse(string yaml, Func<Project, Project>? edit = null)
    {
        var parsed = Analysis.Parse(yaml, "test.yaml");
        return edit is null ? parsed : Analysis.Run(edit(parsed.Project));
    }

    /// <summary>The project with the equipment <paramref name="id"/> replaced by <paramref name="change"/> of it.</summary>
    public static Project WithEquipment(this Project project, string id, Func<Equipment, Equipment> change) =>
        project with { Equipment = [.. project.Equipment.Select(e => e.Id == id ? change(e) : e)] };

    /// <summary>The project with the utility's fault current and X/R at the service.</summary>
    public static Project WithFaultCurrent(this Project project, double ka, double xOverR) =>
        project with { Service = project.Service with { AvailableFaultCurrentKa = ka, FaultXOverR = xOverR } };

    /// <summary>A run's figures by the id of the node it feeds.</summary>
    public static RunResult Run(this AnalysisResult analysis, string id) =>
        analysis.Solution.Runs.Single(r => r.Id == id && r.Kind != RunResultKind.Transformer);
}
