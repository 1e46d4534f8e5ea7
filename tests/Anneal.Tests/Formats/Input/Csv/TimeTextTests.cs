using Anneal.Formats.Input.Csv;

namespace Anneal.Tests.Formats.Input.Csv;

/// <summary>Time rules of notes/csvspec.md: HH 0-47, MM 00-59, or plain non-negative minutes.</summary>
public class TimeTextTests
{
    [Theory]
    [InlineData("07:30", 450)]
    [InlineData("26:15", 1575)]
    [InlineData("47:59", 2879)]
    [InlineData("0:00", 0)]
    [InlineData("90", 90)]
    [InlineData("12.5", 12.5)]
    [InlineData("08:00:00", 480)]   // a spreadsheet's time cell exported with seconds
    [InlineData("08:00:30", 480.5)]
    public void Valid_times(string text, double minutes)
    {
        Assert.True(TimeText.TryParseTime(text, out double t));
        Assert.Equal(minutes, t);
    }

    [Theory]
    [InlineData("25:99")]
    [InlineData("48:00")]
    [InlineData("7:5")]
    [InlineData("08:00:60")]
    [InlineData("08:00:5")]
    [InlineData("-5")]
    [InlineData("ab:cd")]
    [InlineData("NaN")]
    [InlineData("")]
    public void Invalid_times(string text) => Assert.False(TimeText.TryParseTime(text, out _));

    [Fact]
    public void Durations_allow_long_hours() => Assert.True(TimeText.TryParseDuration("72:00", out double d) && d == 4320);
}
