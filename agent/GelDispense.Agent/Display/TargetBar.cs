using System.Text;

namespace GelDispense.Agent.Display;

/// <summary>
/// A text bar from zero toward the target with the acceptance band marked: <c>#</c> filled, <c>.</c> empty, and the
/// band drawn as <c>[</c>…<c>]</c> with <c>=</c> where filled. The scale runs a quarter past the band's top, further
/// when the reading is beyond it, so an over-pour shows as filling past the closing bracket.
/// </summary>
public static class TargetBar
{
    public static string Render(double? netG, double lowG, double highG, int width)
    {
        width = Math.Max(width, 10);
        var value = Math.Max(0, netG ?? 0);
        var scaleG = Math.Max(highG * 1.25, value * 1.02);
        if (scaleG <= 0)
        {
            return "[" + new string('.', width - 2) + "]";
        }

        var cellG = scaleG / width;
        var lowCell = Math.Clamp((int)Math.Floor(lowG / cellG), 0, width - 1);
        var highCell = Math.Clamp((int)Math.Ceiling(highG / cellG) - 1, lowCell, width - 1);
        var filled = (int)Math.Round(value / cellG);
        var bar = new StringBuilder(width + 2);
        for (var cell = 0; cell < width; cell++)
        {
            if (cell == lowCell)
            {
                bar.Append('[');
            }

            var inBand = cell >= lowCell && cell <= highCell;
            bar.Append(cell < filled ? (inBand ? '=' : '#') : (inBand ? ' ' : '.'));
            if (cell == highCell)
            {
                bar.Append(']');
            }
        }

        return bar.ToString();
    }
}
