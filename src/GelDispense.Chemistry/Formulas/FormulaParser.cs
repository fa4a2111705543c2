using System.Globalization;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Chemistry.Formulas;

/// <summary>
/// Parses formulas such as <c>Si(OC2H5)4</c>, <c>[Al(OC4H9)3]</c>, <c>CH3SiO1.5</c> and hydrates such as
/// <c>CuSO4·5H2O</c> or <c>CuSO4.5H2O</c>. A '.' between digits is a decimal point unless the digits after
/// it are followed by an element or a bracket, in which case it separates a hydrate part with its coefficient.
/// Errors are <see cref="InvalidInputException"/>s that give the 1-based position and the reason.
/// </summary>
internal sealed class FormulaParser
{
    private const int MaxLength = 256;
    private const int MaxDepth = 16;
    private readonly string _text;
    private readonly string _field;
    private int _pos;

    private FormulaParser(string text, string field)
    {
        _text = text;
        _field = field;
    }

    public static ChemicalFormula Parse(string? text, string field)
    {
        if (string.IsNullOrWhiteSpace(text))
        {
            throw new InvalidInputException(field, text ?? "", "a formula is required");
        }

        var trimmed = text.Trim();
        if (trimmed.Length > MaxLength)
        {
            throw new InvalidInputException(field, trimmed[..32] + "…", $"a formula may have at most {MaxLength} characters");
        }

        var parser = new FormulaParser(trimmed, field);
        var atoms = parser.ParseFormula();
        return new ChemicalFormula(trimmed, atoms);
    }

    private Dictionary<string, double> ParseFormula()
    {
        var atoms = ParseSequence(depth: 0);
        while (_pos < _text.Length)
        {
            if (!IsHydrateSeparator())
            {
                throw Error(_text[_pos] is ')' or ']' ? "closing bracket without an opening one" : $"unexpected '{_text[_pos]}'");
            }

            _pos++;
            var coefficient = TryReadNumber(isCoefficient: true) ?? 1.0;
            if (coefficient <= 0)
            {
                throw Error("a hydrate coefficient must be positive", _pos - 1);
            }

            var part = ParseSequence(depth: 0);
            if (part.Count == 0)
            {
                throw Error("a hydrate separator must be followed by a formula part");
            }

            Add(atoms, part, coefficient);
        }

        if (atoms.Count == 0)
        {
            throw Error("no element found");
        }

        return atoms;
    }

    private Dictionary<string, double> ParseSequence(int depth)
    {
        var atoms = new Dictionary<string, double>(StringComparer.Ordinal);
        while (_pos < _text.Length)
        {
            var c = _text[_pos];
            if (c is '(' or '[')
            {
                if (depth >= MaxDepth)
                {
                    throw Error($"brackets nested deeper than {MaxDepth}");
                }

                var close = c == '(' ? ')' : ']';
                var open = _pos++;
                var inner = ParseSequence(depth + 1);
                if (_pos >= _text.Length || _text[_pos] != close)
                {
                    throw Error($"bracket opened at position {open + 1} is not closed with '{close}'", open);
                }

                if (inner.Count == 0)
                {
                    throw Error("empty brackets", open);
                }

                _pos++;
                Add(atoms, inner, ReadCount());
            }
            else if (char.IsAsciiLetterUpper(c))
            {
                var start = _pos++;
                while (_pos < _text.Length && char.IsAsciiLetterLower(_text[_pos]))
                {
                    _pos++;
                }

                var symbol = _text.AsSpan(start, _pos - start);
                if (!AtomicWeights.TryGet(symbol, out _))
                {
                    throw Error($"unknown element '{symbol}'", start);
                }

                var key = symbol.ToString();
                atoms[key] = atoms.GetValueOrDefault(key) + ReadCount();
            }
            else if (char.IsAsciiLetterLower(c))
            {
                throw Error($"element symbols start with a capital letter, found '{c}'");
            }
            else
            {
                break;
            }
        }

        return atoms;
    }

    private double ReadCount()
    {
        var count = TryReadNumber() ?? 1.0;
        if (count <= 0)
        {
            throw Error("an atom count must be positive", _pos - 1);
        }

        return count;
    }

    /// <summary>
    /// After a hydrate separator a '.' followed by a digit is always a decimal point (CaSO4·0.5H2O); after an atom
    /// it is one only when no formula part follows (CH3SiO1.5 but CuSO4.5H2O).
    /// </summary>
    private double? TryReadNumber(bool isCoefficient = false)
    {
        var start = _pos;
        while (_pos < _text.Length && char.IsAsciiDigit(_text[_pos]))
        {
            _pos++;
        }

        if (_pos == start)
        {
            return null;
        }

        if (_pos < _text.Length && _text[_pos] == '.'
            && (isCoefficient ? _pos + 1 < _text.Length && char.IsAsciiDigit(_text[_pos + 1]) : !IsHydrateSeparator()))
        {
            _pos++;
            var fractionStart = _pos;
            while (_pos < _text.Length && char.IsAsciiDigit(_text[_pos]))
            {
                _pos++;
            }

            if (_pos == fractionStart)
            {
                throw Error("a decimal point must be followed by digits");
            }
        }

        return double.Parse(_text.AsSpan(start, _pos - start), CultureInfo.InvariantCulture);
    }

    /// <summary>'·' and '*' always separate; '.' does when a formula part (after an optional coefficient) follows.</summary>
    private bool IsHydrateSeparator()
    {
        var c = _text[_pos];
        if (c is '·' or '•' or '*')
        {
            return true;
        }

        if (c != '.')
        {
            return false;
        }

        var next = _pos + 1;
        while (next < _text.Length && char.IsAsciiDigit(_text[next]))
        {
            next++;
        }

        return next < _text.Length && (char.IsAsciiLetterUpper(_text[next]) || _text[next] is '(' or '[');
    }

    private static void Add(Dictionary<string, double> into, Dictionary<string, double> part, double multiplier)
    {
        foreach (var (symbol, count) in part)
        {
            into[symbol] = into.GetValueOrDefault(symbol) + count * multiplier;
        }
    }

    private InvalidInputException Error(string reason, int? position = null) =>
        new(_field, _text, $"{reason} at position {(position ?? _pos) + 1}");
}
