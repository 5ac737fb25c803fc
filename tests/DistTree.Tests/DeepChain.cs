using System.Text;

namespace DistTree.Tests;

/// <summary>A project whose panels feed one another in a line, and a way to run code on a small stack.</summary>
internal static class DeepChain
{
    /// <summary>The text of a chain of <paramref name="levels"/> panelboards, each fed by the one before, and a last one with one 3-pole circuit (balanced: 100 km of line, no neutral current).</summary>
    public static string Text(int levels)
    {
        var text = new StringBuilder("disttree: 1\nproject: { name: Chain }\nservice: { id: SVC, system: 208Y/120 }\nequipment:\n");
        for (var i = 0; i < levels; i++)
        {
            var from = i == 0 ? "SVC" : $"P{i - 1}";
            text.Append($"  - {{ id: P{i}, kind: panelboard, from: {from}, feeder: {{ length: 1, size: 4/0 AWG }} }}\n");
        }

        text.Append($"  - {{ id: END, kind: panelboard, from: P{levels - 1}, circuits: [ {{ id: \"1\", poles: 3, load: {{ va: 100 }}, run: {{ length: 3, size: 12 AWG }} }} ] }}\n");
        return text.ToString();
    }

    /// <summary>
    /// Runs <paramref name="work"/> on a thread with a 256 KiB stack and returns its result, or throws what it
    /// threw: any recursion over a long chain then fails here, not only in production.
    /// </summary>
    public static T OnSmallStack<T>(Func<T> work)
    {
        T result = default!;
        Exception? failure = null;
        var thread = new Thread(
            () =>
            {
                try
                {
                    result = work();
                }
                catch (Exception e)
                {
                    failure = e;
                }
            },
            256 * 1024);
        thread.Start();
        thread.Join();
        Assert.Null(failure);
        return result;
    }
}
