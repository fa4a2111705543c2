using GelDispense.Agent.Configuration;
using GelDispense.Agent.Formats;
using GelDispense.Agent.Links;
using GelDispense.Agent.Stability;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Agent.Tests.Configuration;

public class BalanceSetupTests
{
    private static readonly StationConfig Serial = new() { Balance = new BalanceConfig { Port = "/dev/ttyUSB0" } };

    private static IReadOnlyList<InputError> Errors(StationConfig config) =>
        Assert.Throws<InvalidInputException>(() => BalanceSetup.From(config)).Errors;

    [Fact]
    public void Defaults_give_a_9600_8N1_serial_link_with_the_column_format()
    {
        var setup = BalanceSetup.From(Serial);

        Assert.Equal("/dev/ttyUSB0 9600 8N1", setup.Connector.Describe);
        Assert.Equal("column", setup.Parser.Format.Name);
        Assert.Equal(LineEnding.CrLf, setup.CommandEnding);
        Assert.Equal(StabilityMode.Auto, setup.Stability.Mode);
        Assert.Null(setup.Commands.Tare);
    }

    [Fact]
    public void A_TCP_balance_is_host_and_port()
    {
        var setup = BalanceSetup.From(new StationConfig { Balance = new BalanceConfig { Tcp = "10.0.0.7:4001", Format = "keyed" } });

        Assert.IsType<TcpConnector>(setup.Connector);
        Assert.Equal("tcp://10.0.0.7:4001", setup.Connector.Describe);
    }

    [Fact]
    public void Both_or_neither_connection_is_an_error()
    {
        Assert.Equal("balance.port", Errors(new StationConfig()).Single().Field);
        Assert.Equal("balance.port", Errors(new StationConfig { Balance = new BalanceConfig { Port = "/dev/x", Tcp = "h:1" } }).Single().Field);
    }

    [Fact]
    public void Every_bad_serial_setting_is_reported_at_once_with_field_value_and_reason()
    {
        var config = Serial with
        {
            Balance = Serial.Balance with { Serial = new SerialConfig { Baud = 0, Parity = "sometimes", DataBits = 9, StopBits = "3", Handshake = "maybe", WriteTimeoutMs = 0 } },
        };

        var errors = Errors(config);

        Assert.Equal(
            ["balance.serial.baud", "balance.serial.dataBits", "balance.serial.writeTimeoutMs", "balance.serial.parity", "balance.serial.stopBits", "balance.serial.handshake"],
            errors.Select(e => e.Field));
        Assert.Contains(errors, e => e is { Field: "balance.serial.parity", Value: "sometimes" } && e.Reason.Contains("none, even, odd"));
    }

    [Fact]
    public void A_custom_format_is_chosen_by_name_and_its_errors_carry_its_index()
    {
        var custom = new FormatConfig { Name = "lab-7", Pattern = @"^(?<value>\d+\.\d+)$", DefaultUnit = "mg", LineEnding = "cr" };
        var good = BalanceSetup.From(Serial with { Balance = Serial.Balance with { Format = "lab-7", Formats = [custom] } });
        var bad = Errors(Serial with { Balance = Serial.Balance with { Format = "lab-7", Formats = [custom with { Pattern = "(?<value>[" }] } });

        Assert.Equal(1.5, good.Parser.Parse("1500.0").Reading!.ValueG!.Value, 9);
        Assert.Equal(LineEnding.Cr, good.CommandEnding);
        Assert.Equal("balance.formats[0].pattern", bad[0].Field);
    }

    [Fact]
    public void An_unknown_format_lists_the_known_ones()
    {
        var error = Errors(Serial with { Balance = Serial.Balance with { Format = "mystery" } }).Single();

        Assert.Equal("balance.format", error.Field);
        Assert.Contains("column, keyed, bare", error.Reason);
    }

    [Fact]
    public void Stability_station_and_pipette_errors_are_named()
    {
        var config = Serial with
        {
            ServiceAddress = "ftp://x",
            StationId = "bay 3",
            Stability = new StabilityConfig { Mode = "guess", MinReadings = 1, BandG = 0, WindowS = 30, DriftWindowS = 10 },
            Pipette = new PipetteConfig { NominalVolumeUl = 100, MinVolumeUl = 200 },
        };

        Assert.Equal(
            ["stability.mode", "stability.minReadings", "stability.bandG", "stability.driftWindowS", "serviceAddress", "stationId", "pipette.minVolumeUl"],
            Errors(config).Select(e => e.Field));
    }

    [Fact]
    public void A_vessel_with_a_negative_tare_or_no_volume_is_refused_field_by_field()
    {
        var config = Serial with { Vessel = new VesselConfig { TareG = -2, CapacityMl = 0 } };

        Assert.Equal(["vessel.tareG", "vessel.capacityMl"], Errors(config).Select(e => e.Field));
        Assert.NotNull(BalanceSetup.From(Serial with { Vessel = new VesselConfig { TareG = 63.5 } }));
    }

    [Fact]
    public void Standby_addresses_that_are_not_http_mix_schemes_or_repeat_are_each_named_by_index()
    {
        var config = Serial with
        {
            ServiceAddress = "http://replica-a:5081",
            StandbyAddresses = ["http://replica-b:5081", "replica-c", "https://replica-d:5081", "http://replica-a:5081"],
        };

        var errors = Errors(config);

        Assert.Equal(["standbyAddresses[1]", "standbyAddresses[2]", "standbyAddresses[3]"], errors.Select(e => e.Field));
        Assert.Contains("same scheme", errors[1].Reason, StringComparison.Ordinal);
        Assert.Contains("twice", errors[2].Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Distinct_standby_addresses_of_the_same_scheme_are_accepted()
    {
        var setup = BalanceSetup.From(Serial with { StandbyAddresses = ["http://127.0.0.1:6081", "http://127.0.0.1:7081"] });

        Assert.Equal("column", setup.Parser.Format.Name);
    }
}
