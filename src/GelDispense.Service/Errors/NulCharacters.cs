using System.Collections;
using System.Collections.Concurrent;
using System.Globalization;
using GelDispense.Chemistry.Errors;
using Google.Protobuf;
using Google.Protobuf.Reflection;
using GelDispense.Service.Mapping;

namespace GelDispense.Service.Errors;

/// <summary>
/// Finds text fields holding U+0000 anywhere in a request. PostgreSQL text cannot store it (the insert or even the
/// lookup fails with "invalid byte sequence"), so such a value reached the database as an internal error; SQLite
/// stored it. Refusing it at the edge gives both engines the same answer, with the field's path, before any work.
/// </summary>
public static class NulCharacters
{
    /// <summary>Per message type, the fields that are text or may hold text further down; empty for the rest.</summary>
    private static readonly ConcurrentDictionary<MessageDescriptor, FieldDescriptor[]> TextBearing = new();

    public static IReadOnlyList<InputError> Find(IMessage request)
    {
        if (!HasNul(request))
        {
            return [];
        }

        // Rare: walk again, this time building each field's path, to name every offending field.
        List<InputError>? errors = null;
        Walk(request, "", ref errors);
        return errors ?? (IReadOnlyList<InputError>)[];
    }

    /// <summary>The check every call pays: no paths, no allocation.</summary>
    private static bool HasNul(object? value) => value switch
    {
        string text => text.Contains('\0', StringComparison.Ordinal),
        IMessage message => HasNulInFields(message),
        IDictionary map => HasNulInEntries(map),
        IList list => HasNulInItems(list),
        _ => false,
    };

    private static bool HasNulInFields(IMessage message)
    {
        foreach (var field in TextBearing.GetOrAdd(message.Descriptor, FieldsToWalk))
        {
            if (HasNul(field.Accessor.GetValue(message)))
            {
                return true;
            }
        }

        return false;
    }

    private static bool HasNulInEntries(IDictionary map)
    {
        foreach (DictionaryEntry entry in map)
        {
            if (HasNul(entry.Key) || HasNul(entry.Value))
            {
                return true;
            }
        }

        return false;
    }

    private static bool HasNulInItems(IList list)
    {
        for (var i = 0; i < list.Count; i++)
        {
            if (HasNul(list[i]))
            {
                return true;
            }
        }

        return false;
    }

    private static void Walk(IMessage message, string path, ref List<InputError>? errors)
    {
        foreach (var field in TextBearing.GetOrAdd(message.Descriptor, FieldsToWalk))
        {
            var name = path.Length == 0 ? field.JsonName : $"{path}.{field.JsonName}";
            switch (field.Accessor.GetValue(message))
            {
                case string text:
                    Check(text, name, ref errors);
                    break;
                case IMessage child:
                    Walk(child, name, ref errors);
                    break;
                case IDictionary map:
                    foreach (DictionaryEntry entry in map)
                    {
                        var at = $"{name}[{entry.Key}]";
                        Check(entry.Key as string, at, ref errors);
                        Visit(entry.Value, at, ref errors);
                    }

                    break;
                case IList list:
                    for (var i = 0; i < list.Count; i++)
                    {
                        Visit(list[i], string.Create(CultureInfo.InvariantCulture, $"{name}[{i}]"), ref errors);
                    }

                    break;
            }
        }
    }

    private static void Visit(object? value, string path, ref List<InputError>? errors)
    {
        if (value is IMessage child)
        {
            Walk(child, path, ref errors);
        }
        else
        {
            Check(value as string, path, ref errors);
        }
    }

    private static void Check(string? text, string path, ref List<InputError>? errors)
    {
        if (text is not null && text.Contains('\0', StringComparison.Ordinal))
        {
            (errors ??= []).Add(new InputError(path, RecipeMapping.Clip(text.Replace("\0", "\\0", StringComparison.Ordinal)),
                "text may not contain the NUL character (U+0000)"));
        }
    }

    private static FieldDescriptor[] FieldsToWalk(MessageDescriptor descriptor) =>
        [.. descriptor.Fields.InFieldNumberOrder().Where(f => MayHoldText(f, []))];

    private static bool MayHoldText(FieldDescriptor field, HashSet<MessageDescriptor> seen) =>
        field.IsMap
            ? field.MessageType.Fields.InFieldNumberOrder().Any(f => MayHoldText(f, seen))
            : field.FieldType switch
            {
                FieldType.String => true,
                FieldType.Message or FieldType.Group => seen.Add(field.MessageType) && field.MessageType.Fields.InFieldNumberOrder().Any(f => MayHoldText(f, seen)),
                _ => false,
            };
}
