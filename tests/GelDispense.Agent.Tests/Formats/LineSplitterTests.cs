using System.Text;
using GelDispense.Agent.Formats;

namespace GelDispense.Agent.Tests.Formats;

public class LineSplitterTests
{
    private static List<SplitLine> Split(LineSplitter splitter, params byte[][] chunks)
    {
        var lines = new List<SplitLine>();
        foreach (var chunk in chunks)
        {
            splitter.Feed(chunk, lines.Add);
        }

        return lines;
    }

    private static byte[] B(string s) => Encoding.Latin1.GetBytes(s);

    [Fact]
    public void Mixed_line_endings_each_end_exactly_one_line()
    {
        var lines = Split(new LineSplitter(64), B("a\r\nb\nc\rd\n\re\r\n"));

        Assert.Equal(["a", "b", "c", "d", "e"], lines.Select(l => l.Text));
    }

    [Fact]
    public void A_CR_LF_pair_split_across_reads_does_not_make_an_extra_line()
    {
        var lines = Split(new LineSplitter(64), B("12.5\r"), B("\n13.0\r"), B("\n"));

        Assert.Equal(["12.5", "13.0"], lines.Select(l => l.Text));
    }

    [Fact]
    public void A_partial_line_is_held_until_its_terminator_arrives()
    {
        var splitter = new LineSplitter(64);
        var first = Split(splitter, B("= +    1"));
        Assert.Empty(first);
        Assert.True(splitter.HasPartialLine);

        var second = Split(splitter, B("2.3456 g\r\n"));

        Assert.Equal("= +    12.3456 g", Assert.Single(second).Text);
        Assert.False(splitter.HasPartialLine);
    }

    [Fact]
    public void Non_text_bytes_are_counted_and_taint_their_line()
    {
        var splitter = new LineSplitter(64);
        var lines = Split(splitter, [0x31, 0x32, 0xFF, 0x00, 0x2E, 0x35, 0x0A, 0x37, 0x0A]);

        Assert.Equal(2, lines.Count);
        Assert.Equal(new SplitLine("12.5", 2, false), lines[0]);
        Assert.True(lines[1].IsClean);
        Assert.Equal(2, splitter.NonTextBytesSeen);
    }

    [Fact]
    public void A_line_made_only_of_noise_still_comes_out_so_it_can_be_counted()
    {
        var lines = Split(new LineSplitter(64), [0x80, 0x81, 0x1B, 0x0D]);

        Assert.Equal(new SplitLine("", 3, false), Assert.Single(lines));
    }

    [Fact]
    public void A_very_long_line_is_cut_flagged_and_memory_stays_bounded()
    {
        var splitter = new LineSplitter(16);
        var lines = Split(splitter, B(new string('9', 100_000) + "\n1.0\n"));

        Assert.Equal(2, lines.Count);
        Assert.True(lines[0].Overlong);
        Assert.Equal(16, lines[0].Text.Length);
        Assert.Equal(new SplitLine("1.0", 0, false), lines[1]);
    }

    [Fact]
    public void Empty_lines_are_skipped()
    {
        var splitter = new LineSplitter(64);
        var lines = Split(splitter, B("\n\n\r\r\n1\n\n"));

        Assert.Equal("1", Assert.Single(lines).Text);
        Assert.Equal(1, splitter.LinesSeen);
    }

    [Fact]
    public void A_splitter_that_starts_mid_line_drops_everything_before_the_first_terminator()
    {
        var splitter = new LineSplitter(64, startsMidLine: true);

        var lines = Split(splitter, B("00"), B(" g\r\n= +    1.0000 g\r\n"));

        Assert.Equal("= +    1.0000 g", Assert.Single(lines).Text);
        Assert.Equal(4, splitter.BytesDroppedAtStart);
    }
}
