using GelDispense.Chemistry.Errors;
using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.Agent.Station;

/// <summary>Reads a recipe in the API's JSON shape (the <c>recipe</c> body of POST /v1/batches), with readable errors.</summary>
public static class RecipeFile
{
    public static Recipe Load(string path)
    {
        if (!File.Exists(path))
        {
            throw new InvalidInputException("recipe", path, "file not found");
        }

        return Parse(File.ReadAllText(path), path);
    }

    public static Recipe Parse(string json, string origin)
    {
        try
        {
            return JsonParser.Default.Parse<Recipe>(json);
        }
        catch (InvalidJsonException ex)
        {
            throw new InvalidInputException("recipe", origin, $"not valid recipe JSON: {ex.Message}");
        }
        catch (InvalidProtocolBufferException ex)
        {
            throw new InvalidInputException("recipe", origin, $"not a recipe: {ex.Message}");
        }
    }
}
