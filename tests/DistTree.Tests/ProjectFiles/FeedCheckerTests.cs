using System.Text;
using DistTree.Diagnostics;
using DistTree.ProjectFiles;

namespace DistTree.Tests.ProjectFiles;

/// <summary>
/// FeedChecker, through the loader: feed cycles and the equipment that leads into them are located errors, found
/// by QuikGraph's searches without recursion, reported in the order of the walk along 'from'.
/// </summary>
public sealed class FeedCheckerTests
{
    private const string Head = "disttree: 1\nproject: { name: Feeds }\nservice: { id: SVC, system: 480Y/277 }\nequipment:\n";

    [Fact]
    public void Check_CycleOf100000_OneErrorAtTheFirstMemberOnASmallStack()
    {
        const int members = 100_000;
        var text = Project(Enumerable.Range(0, members).Select(i => ($"E{i}", $"E{(i + members - 1) % members}")));

        var error = DeepChain.OnSmallStack(() => Assert.Throws<ProjectException>(() => ProjectLoader.Parse(text, "ring.yaml")));

        var cycle = Assert.Single(error.Diagnostics);
        Assert.Equal(new SourceLocation("ring.yaml", 5, 40), cycle.Location);
        Assert.Equal(
            "feed cycle: 'E0' is fed from 'E99999', which is fed from 'E99998', which is fed from 'E99997', which is fed from 'E99996', "
            + "which is fed from 'E99995', which is fed from 'E99994', which is fed from 'E99993', which is fed from 'E99992', "
            + "which is fed from 'E99991', which is fed from 'E99990', and so on through 99,989 more back to 'E0' (100,000 in all); "
            + "the service reaches none of them",
            cycle.Message);
    }

    [Fact]
    public void Check_ChainOf100000IntoACycle_ErrorsInTheOrderOfTheWalkBack()
    {
        // T0 is fed from T1, … T99999 from A; A and B feed each other. The walk from T0 closes the cycle first, then
        // reports back along itself, T99999 to T0: the 200 errors kept are the cycle's and the last 199 links'.
        const int links = 100_000;
        var feeds = Enumerable.Range(0, links).Select(i => ($"T{i}", i + 1 < links ? $"T{i + 1}" : "A")).Append(("A", "B")).Append(("B", "A"));

        var error = DeepChain.OnSmallStack(() => Assert.Throws<ProjectException>(() => ProjectLoader.Parse(Project(feeds), "tail.yaml")));

        Assert.Equal(201, error.Diagnostics.Count);
        Assert.Equal(
            "tail.yaml:99806:44: error: 'T99801' is not reached from the service 'SVC': following 'from' leads into the feed cycle at 'A'",
            error.Diagnostics[0].ToString());
        Assert.Equal("tail.yaml:100005:39: error: feed cycle: 'A' is fed from 'B', which is fed from 'A'; the service reaches none of them", error.Diagnostics[199].ToString());
        Assert.Equal("tail.yaml:99805:44: error: 99,801 more errors from here on not shown (the first 200 of 100,001 are)", error.Diagnostics[200].ToString());
    }

    [Fact]
    public void Check_RandomFeeds_EachCycleOnceAndEachLinkIntoOneNamedByWhereFollowingFromEntersIt()
    {
        for (var seed = 0; seed < 300; seed++)
        {
            var random = new Random(seed);
            var count = random.Next(1, 60);
            var feeds = Enumerable.Range(0, count)
                .Select(i => ($"E{i}", random.Next(5) == 0 ? "SVC" : $"E{random.Next(count)}"))
                .ToArray();

            var expected = Expected(feeds);
            var found = Errors(Project(feeds));

            Assert.True(expected.SetEquals(found), $"seed {seed}: expected\n{string.Join('\n', expected.Order())}\nfound\n{string.Join('\n', found.Order())}");
        }
    }

    [Fact]
    public void Check_EquipmentFedThroughTheService_NoFeedErrors()
    {
        var feeds = new[] { ("A", "SVC"), ("B", "A"), ("C", "B"), ("D", "A") };

        Assert.Equal(4, ProjectLoader.Parse(Project(feeds), "t.yaml").Equipment.Count);
    }

    // Switchboards, one a line (line 5 is the first), each fed from its source.
    private static string Project(IEnumerable<(string Id, string From)> feeds)
    {
        var text = new StringBuilder(Head);
        foreach (var (id, from) in feeds)
        {
            text.Append("  - { id: ").Append(id).Append(", kind: switchboard, from: ").Append(from).Append(" }\n");
        }

        return text.ToString();
    }

    private static HashSet<string> Errors(string text)
    {
        try
        {
            ProjectLoader.Parse(text, "t.yaml");
            return [];
        }
        catch (ProjectException e)
        {
            return [.. e.Diagnostics.Select(d => d.ToString())];
        }
    }

    // What following 'from' by hand finds: each cycle once, at its member first in the file, listed from there; each
    // piece of equipment whose 'from' leads into a cycle, naming the first member it reaches.
    private static HashSet<string> Expected((string Id, string From)[] feeds)
    {
        var index = feeds.Select((feed, i) => (feed.Id, i)).ToDictionary(p => p.Id, p => p.i);
        var errors = new HashSet<string>();
        for (var start = 0; start < feeds.Length; start++)
        {
            var seen = new List<int>();
            var at = start;
            while (at >= 0 && !seen.Contains(at))
            {
                seen.Add(at);
                at = feeds[at].From == "SVC" ? -1 : index[feeds[at].From];
            }

            if (at < 0)
            {
                continue; // reached from the service
            }

            if (at == start)
            {
                // A member: every member's walk gives the same error, kept once.
                var cycle = seen;
                var first = cycle.Min();
                var ordered = cycle.Skip(cycle.IndexOf(first)).Concat(cycle.Take(cycle.IndexOf(first))).ToList();
                errors.Add(ordered.Count == 1
                    ? $"t.yaml:{first + 5}:{Column(feeds[first].Id)}: error: '{feeds[first].Id}' is fed from itself: a feed cycle that the service does not reach"
                    : $"t.yaml:{first + 5}:{Column(feeds[first].Id)}: error: feed cycle: '{feeds[first].Id}' is fed from {string.Join(", which is fed from ", ordered.Skip(1).Append(first).Select(m => $"'{feeds[m].Id}'"))}; the service reaches none of them");
                continue;
            }

            errors.Add($"t.yaml:{start + 5}:{Column(feeds[start].Id)}: error: '{feeds[start].Id}' is not reached from the service 'SVC': following 'from' leads into the feed cycle at '{feeds[at].Id}'");
        }

        return errors;
    }

    // The column of the value of 'from' on a line as Project writes it.
    private static int Column(string id) => "  - { id: ".Length + id.Length + ", kind: switchboard, from: ".Length + 1;
}
