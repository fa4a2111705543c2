using GelDispense.Agent.Configuration;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Tests.Configuration;

public class StationConfigLoaderTests
{
    private const string Full = """
        {
          // bay 3, the fume-hood bench
          "serviceAddress": "http://127.0.0.1:5081",
          "stationId": "bay-3",
          "apiKey": "k-123",
          "balance": {
            "port": "/dev/serial/by-id/usb-bridge-if00",
            "format": "lab-7",
            "formats": [ { "name": "lab-7", "pattern": "^W(?<flag>[SD])(?<value>[+-]\\d+\\.\\d+)(?<unit>g)$", "stableFlag": "S" } ],
            "serial": { "baud": 19200, "parity": "even", "dataBits": 7, "stopBits": "1", "handshake": "rtscts" },
            "commands": { "tare": "T!", "read": "R?" },
            "readabilityG": 0.001,
          },
          "stability": { "mode": "software", "minReadings": 8, "bandG": 0.002, "windowS": 2 },
          "pipette": { "name": "bay-3 1000 uL pipette", "nominalVolumeUl": 1000, "minVolumeUl": 100 }
        }
        """;

    [Fact]
    public void A_full_config_with_comments_and_trailing_commas_loads()
    {
        var config = StationConfigLoader.Parse(Full);

        Assert.Equal("bay-3", config.StationId);
        Assert.Equal(19200, config.Balance.Serial.Baud);
        Assert.Equal("T!", config.Balance.Commands.Tare);
        Assert.Null(config.Balance.Commands.Zero);
        Assert.Equal(8, config.Stability.MinReadings);
        Assert.Equal(20, config.Stability.DriftWindowS);
        Assert.Equal(1000, config.Pipette!.NominalVolumeUl);
    }

    [Fact]
    public void An_unknown_field_is_refused_by_its_path()
    {
        var ex = Assert.Throws<InvalidInputException>(() => StationConfigLoader.Parse("""{ "balance": { "port": "/dev/x", "bauds": 9600 } }"""));

        var error = Assert.Single(ex.Errors);
        Assert.Equal("balance.bauds", error.Field);
        Assert.Equal("9600", error.Value);
        Assert.Equal("unknown field", error.Reason);
    }

    [Fact]
    public void A_wrong_type_names_the_field_and_shows_the_value()
    {
        var ex = Assert.Throws<InvalidInputException>(() => StationConfigLoader.Parse("""{ "balance": { "serial": { "baud": "fast" } } }"""));

        Assert.Equal("balance.serial.baud", ex.Errors[0].Field);
        Assert.Equal("\"fast\"", ex.Errors[0].Value);
    }

    [Fact]
    public void A_null_section_is_refused_rather_than_crashing_later()
    {
        var ex = Assert.Throws<InvalidInputException>(() => StationConfigLoader.Parse("""{ "balance": null }"""));

        Assert.Equal("balance", ex.Errors[0].Field);
    }

    [Fact]
    public void Broken_JSON_gives_the_line()
    {
        var ex = Assert.Throws<InvalidInputException>(() => StationConfigLoader.Parse("{\n  \"stationId\": \"a\"\n  \"apiKey\": 1\n}"));

        Assert.StartsWith("line 3", ex.Errors[0].Value);
        Assert.Equal("not valid JSON", ex.Errors[0].Reason);
    }

    [Fact]
    public void A_missing_file_is_named()
    {
        var ex = Assert.Throws<InvalidInputException>(() => StationConfigLoader.Load("/nonexistent/station.json"));

        Assert.Equal(new InputError("config", "/nonexistent/station.json", "file not found"), ex.Errors[0]);
    }

    [Fact]
    public void The_example_station_file_shipped_with_the_agent_loads_and_resolves()
    {
        var root = new DirectoryInfo(AppContext.BaseDirectory);
        while (root is not null && !File.Exists(Path.Combine(root.FullName, "GelDispense.sln")))
        {
            root = root.Parent;
        }

        var config = StationConfigLoader.Load(Path.Combine(root!.FullName, "agent", "GelDispense.Agent", "station.example.json"));
        var setup = BalanceSetup.From(config);

        Assert.Equal("bay-3", config.StationId);
        Assert.Equal(TimeSpan.FromSeconds(10), setup.Reconnect.SilenceLimit);
    }
}
