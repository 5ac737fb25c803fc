using System.Diagnostics;
using System.Globalization;
using DistTree.Reports;

namespace DistTree.Tests.Reports;

/// <summary>The demo report opened in a real browser (headless Chromium): it loads, and its drawings have size.</summary>
public sealed class HtmlReportBrowserTests
{
    [ChromiumFact]
    public void Render_DemoInChromium_ShowsTitleTreeAndBars()
    {
        var dir = Directory.CreateTempSubdirectory("disttree-browser-");
        try
        {
            var page = Path.Combine(dir.FullName, "quillfeather-medical.html");
            File.WriteAllText(page, HtmlReport.Render(ReportFixtures.Demo, HtmlReportOptions.Default));
            var url = new Uri(page).AbsoluteUri;

            var dom = RunChromium(dir.FullName, "--dump-dom", url);
            var doc = ReportFixtures.Parse(dom);
            Assert.Equal($"{ReportFixtures.Demo.Project.Name} · voltage-drop review", doc.Title);
            var tree = doc.QuerySelector("svg.tree");
            Assert.NotNull(tree);
            Assert.True(Number(tree.GetAttribute("width")) > 0);
            Assert.True(Number(tree.GetAttribute("height")) > 0);
            Assert.NotEmpty(doc.QuerySelectorAll("svg.tree g.node"));
            var bars = doc.QuerySelectorAll("#worst svg.bar").ToArray();
            Assert.Equal(10, bars.Length);
            Assert.All(bars, bar => Assert.Contains(bar.QuerySelectorAll("rect.seg"), seg => Number(seg.GetAttribute("width")) > 0));
            Assert.Empty(doc.QuerySelectorAll("script"));

            var png = Path.Combine(dir.FullName, "out.png");
            RunChromium(dir.FullName, $"--screenshot={png}", "--window-size=1280,2000", url);
            Assert.True(File.Exists(png), "Chromium wrote no screenshot");
            var bytes = File.ReadAllBytes(png);
            Assert.True(bytes.Length > 20_000, $"screenshot of {bytes.Length} bytes is too small to show the page");
            Assert.Equal([0x89, (byte)'P', (byte)'N', (byte)'G'], bytes[..4]);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    private static double Number(string? text) => double.Parse(text ?? "0", CultureInfo.InvariantCulture);

    private static string RunChromium(string workDir, params string[] args)
    {
        var profile = Directory.CreateTempSubdirectory("disttree-chromium-profile-");
        try
        {
            var start = new ProcessStartInfo(ChromiumFactAttribute.Path)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                WorkingDirectory = workDir,
            };
            foreach (var a in new[] { "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", $"--user-data-dir={profile.FullName}" }.Concat(args))
            {
                start.ArgumentList.Add(a);
            }

            using var process = Process.Start(start)!;
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit(120_000))
            {
                process.Kill(entireProcessTree: true);
                Assert.Fail("Chromium did not finish within 120 s");
            }

            Assert.True(process.ExitCode == 0, $"Chromium exited with {process.ExitCode}: {stderr.Result}");
            return stdout.Result;
        }
        finally
        {
            profile.Delete(recursive: true);
        }
    }
}
