using Anneal.Core.DrivingRules;

namespace Anneal.Tests.Core.DrivingRules;

/// <summary>
/// The presets' values against the regulations. No copy of either text was at hand when this was written: every value
/// below is from memory, and agrees with the summary in the issue that asked for the presets (issue 22).
/// </summary>
public class DrivingPresetsTests
{
    [Fact]
    public void Eu_561_holds_the_limits_of_regulation_561_2006()
    {
        var eu = DrivingPresets.Find("eu-561")!;

        Assert.Equal(270, eu.DrivingBeforeBreak); // Art. 7: after 4 h 30 of driving (from memory)
        Assert.Equal(45, eu.BreakMinutes);        // Art. 7: a break of at least 45 min (from memory)
        Assert.Equal(15, eu.SplitFirst);          // Art. 7: or at least 15 min ... (from memory)
        Assert.Equal(30, eu.SplitSecond);         // ... followed by at least 30 min (from memory)
        Assert.Equal(540, eu.DailyDriving);       // Art. 6(1): daily driving at most 9 h (from memory)
        Assert.Equal(780, eu.DutySpan);           // Art. 8(2) with Art. 4(g): 24 h less an 11 h daily rest (from memory)
        Assert.Contains("561/2006", eu.Source, StringComparison.Ordinal);
        Assert.True(eu.Rule.Hard);
    }

    [Fact]
    public void Us_hos_property_holds_the_limits_of_49_cfr_395_3()
    {
        var us = DrivingPresets.Find("us-hos-property")!;

        Assert.Equal(480, us.DrivingBeforeBreak); // 395.3(a)(3)(ii): 30 min break after 8 h of driving (from memory)
        Assert.Equal(30, us.BreakMinutes);
        Assert.False(us.MaySplit);
        Assert.Equal(660, us.DailyDriving);       // 395.3(a)(3)(i): 11 h of driving (from memory)
        Assert.Equal(840, us.DutySpan);           // 395.3(a)(2): within the 14 h window (from memory)
        Assert.Contains("395.3", us.Source, StringComparison.Ordinal);
    }

    [Fact]
    public void Preset_names_are_found_in_any_case_and_others_are_not()
    {
        Assert.Same(DrivingPresets.Eu, DrivingPresets.Find("EU-561"));
        Assert.Null(DrivingPresets.Find("eu-562"));
    }
}
