package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.survey.AttitudeSeries;
import org.leadline.survey.NavigationSeries;
import org.leadline.survey.PingTable;
import org.leadline.survey.WaterLevelSeries;

class CsvReadersTest {
    @TempDir Path dir;

    private Path file(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    private static Path res(String name) { return Path.of("src/test/resources", name); }

    /** Asserts the error's file, line and column and a fragment of its message. */
    private static void fails(Runnable r, Path file, long line, int column, String fragment) {
        assertThatThrownBy(r::run).isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.file()).isEqualTo(file.toString());
            assertThat(e.line()).as("line of: " + e.getMessage()).isEqualTo(line);
            assertThat(e.column()).as("column of: " + e.getMessage()).isEqualTo(column);
            assertThat(e.getMessage()).startsWith(file + (line > 0 ? ":" + line : "") + (column > 0 ? ":" + column : "") + ": ")
                    .contains(fragment);
        });
    }

    // 2026-05-14T09:15:02.250Z: 20587 days after 1970-01-01 (worked by hand: 56 years with 14 leap
    // days = 20454 days to 2026-01-01, plus 31+28+31+30+13 = 133 days) -> 20587*86400 + 33302.25
    private static final double T0 = 20587 * 86400.0 + 9 * 3600 + 15 * 60 + 2.25;

    @Test
    void isoTimeFastPathAgreesWithJavaTime() {
        assertThat(IsoTime.parse("2026-05-14T09:15:02.250Z")).isEqualTo(T0);
        assertThat(IsoTime.parse("2026-05-14T09:15:02.250+00:00")).isEqualTo(T0);
        assertThat(IsoTime.parse("2026-05-14T11:15:02.250+02:00")).isEqualTo(T0);
        assertThat(IsoTime.parse("2026-05-14 09:15:02.25")).isEqualTo(T0);
        assertThat(IsoTime.parse("1970-01-01T00:00:00Z")).isEqualTo(0.0);
        assertThat(IsoTime.parse("2024-02-29T00:00:00Z"))
                .isEqualTo((double) java.time.Instant.parse("2024-02-29T00:00:00Z").getEpochSecond());
        assertThat(IsoTime.parse("2026-05-14T09:15:02.123456Z")).isCloseTo(T0 - 0.25 + 0.123456, within(1e-6));
        assertThatThrownBy(() -> IsoTime.parse("2026-02-30T00:00:00Z")).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> IsoTime.parse("2026-06-30T23:59:60Z")).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> IsoTime.parse("14/05/2026 09:15")).isInstanceOf(IllegalArgumentException.class);
        assertThat(IsoTime.format(T0)).isEqualTo("2026-05-14T09:15:02.250Z");
    }

    @Test
    void readsGoodPingFile() {
        PingTable p = PingCsvReader.read(res("pings/line1.csv"));
        assertThat(p.size).isEqualTo(3);
        assertThat(p.time[0]).isEqualTo(T0);
        assertThat(p.time[2]).isEqualTo(T0 + 0.75);
        assertThat(p.lat[2]).isEqualTo(50.10001);
        assertThat(p.lon[2]).isEqualTo(-1.19999);
        assertThat(p.twtt[1]).isEqualTo(0.014);
        assertThat(p.depth[1]).isNaN();
        assertThat(p.angle[1]).isEqualTo(30.0);
        assertThat(p.heading[2]).isEqualTo(46.0);
        assertThat(p.heave[2]).isEqualTo(-0.02);
        assertThat(p.roll[2]).isEqualTo(-0.7);
        assertThat(p.pitch[2]).isEqualTo(0.2);
        assertThat(p.lineName(2)).isEqualTo("L001");
        assertThat(p.beam[1]).isEqualTo(1);
        assertThat(p.quality[2]).isEqualTo(2);
    }

    @Test
    void pingFileMinimalColumnsAndSeparateNavigation() throws IOException {
        Path f = file("p.csv", "TIME,DEPTH\n2026-05-14T09:15:02.250Z,12.5\n2026-05-14T09:15:03Z,12.6");
        fails(() -> PingCsvReader.read(f), f, 1, 0, "expected a column 'lat'");
        PingTable p = PingCsvReader.read(f, true);
        assertThat(p.size).isEqualTo(2);
        assertThat(p.depth[1]).isEqualTo(12.6);
        assertThat(p.twtt[1]).isNaN();
        assertThat(p.lat[0]).isNaN();
        assertThat(p.line[0]).isEqualTo(-1);
        assertThat(p.beam[0]).isEqualTo(-1);
    }

    @Test
    void pingFileErrorsNameLineAndColumn() throws IOException {
        String head = "# comment\ntime,lat,lon,twtt,roll\n";
        String ok = "2026-05-14T09:15:02Z,50.1,-1.2,0.0133,0.5\n";
        Path missing = file("m.csv", head.replace(",twtt", ",range") + ok);
        fails(() -> PingCsvReader.read(missing), missing, 2, 0, "expected a column 'twtt' or 'depth'");
        Path badNumber = file("b.csv", head + ok + "\n2026-05-14T09:15:03Z,50.1,-1.2,0.0x,0.5\n");
        fails(() -> PingCsvReader.read(badNumber), badNumber, 5, 4, "expected a number for 'twtt', found '0.0x'");
        Path nan = file("n.csv", head + ok + "2026-05-14T09:15:03Z,50.1,-1.2,0.0133,NaN\n");
        fails(() -> PingCsvReader.read(nan), nan, 4, 5, "expected a finite number for 'roll', found 'NaN'");
        Path inf = file("i.csv", head + ok + "2026-05-14T09:15:03Z,50.1,Infinity,0.0133,1\n");
        fails(() -> PingCsvReader.read(inf), inf, 4, 3, "finite");
        Path lat = file("l.csv", head + ok + "# another\n2026-05-14T09:15:03Z,91,-1.2,0.0133,1");
        fails(() -> PingCsvReader.read(lat), lat, 5, 2, "expected a latitude in [-90, 90] degrees, found 91");
        Path lon = file("o.csv", head + ok + "2026-05-14T09:15:03Z,50,-180.5,0.0133,1\n");
        fails(() -> PingCsvReader.read(lon), lon, 4, 3, "longitude");
        Path order = file("t.csv", head + ok + ok + "2026-05-14T09:15:01Z,50.1,-1.2,0.0133,1\n");
        fails(() -> PingCsvReader.read(order), order, 5, 1, "expected times not to decrease");
        Path badTime = file("bt.csv", head + "2026-05-14 9:15,50.1,-1.2,0.0133,1\n");
        fails(() -> PingCsvReader.read(badTime), badTime, 3, 1, "expected an ISO-8601 UTC time");
        Path noRange = file("nr.csv", head + "2026-05-14T09:15:03Z,50.1,-1.2,,1\n");
        fails(() -> PingCsvReader.read(noRange), noRange, 3, 4, "expected a value for 'twtt' or 'depth'");
        Path shortRow = file("s.csv", head + "2026-05-14T09:15:03Z,50.1\n");
        fails(() -> PingCsvReader.read(shortRow), shortRow, 3, 3, "expected a number for 'lon', found an empty field");
        Path crlf = file("c.csv", (head + ok + "2026-05-14T09:15:03Z,50.1,-1.2,-1,1\n").replace("\n", "\r\n"));
        fails(() -> PingCsvReader.read(crlf), crlf, 4, 4, "expected 'twtt' >= 0");
    }

    @Test
    void readsNavigationAttitudeAndWaterLevel() {
        NavigationSeries nav = NavigationCsvReader.read(res("series/nav.csv"));
        assertThat(nav.size()).isEqualTo(3);
        double t0 = IsoTime.parse("2026-05-14T09:15:00Z");
        assertThat(nav.series().time(2)).isEqualTo(t0 + 2);
        assertThat(nav.series().value(1, 2)).isEqualTo(-1.00002);
        AttitudeSeries att = AttitudeCsvReader.read(res("series/attitude.csv"));
        assertThat(att.size()).isEqualTo(2);
        assertThat(att.heading(t0 + 0.25)).isCloseTo(0.0, within(1e-12)); // 359 -> 1 through 0
        assertThat(att.heave(t0 + 0.25)).isCloseTo(0.15, within(1e-12));
        WaterLevelSeries wl = WaterLevelCsvReader.read(res("series/tide.csv"));
        assertThat(wl.level(IsoTime.parse("2026-05-14T09:05:00Z"))).isCloseTo(1.35, within(1e-12));
    }

    @Test
    void seriesFileErrors() throws IOException {
        Path nav = file("nav.csv", "time,lat,lon\n2026-05-14T09:15:00Z,50,-1\n2026-05-14T09:15:00Z,50,-1\n");
        fails(() -> NavigationCsvReader.read(nav), nav, 3, 1, "expected times to increase strictly");
        Path nav2 = file("nav2.csv", "time,lon,lat\n2026-05-14T09:15:00Z,-1,-91\n");
        fails(() -> NavigationCsvReader.read(nav2), nav2, 2, 3, "found -91");
        Path nav3 = file("nav3.csv", "time,lat\n2026-05-14T09:15:00Z,50\n");
        fails(() -> NavigationCsvReader.read(nav3), nav3, 1, 0, "expected a column 'lon'");
        Path att = file("att.csv", "time,heave,roll\n2026-05-14T09:15:00Z,0.1,1\n2026-05-14T09:15:01Z,0.1,nan\n");
        fails(() -> AttitudeCsvReader.read(att), att, 3, 3, "expected a finite number for 'roll'");
        Path att2 = file("att2.csv", "time,speed\n2026-05-14T09:15:00Z,1\n");
        fails(() -> AttitudeCsvReader.read(att2), att2, 1, 0, "'heading', 'heave', 'roll' or 'pitch'");
        Path att3 = file("att3.csv", "time,heave\n2026-05-14T09:15:01Z,0.1\n2026-05-14T09:15:00Z,0.1\n");
        fails(() -> AttitudeCsvReader.read(att3), att3, 3, 1, "increase strictly");
        Path wl = file("wl.csv", "#gauge\ntime,level\n2026-05-14T09:00:00Z,1.2\n2026-05-14T09:10:00Z,abc\n");
        fails(() -> WaterLevelCsvReader.read(wl), wl, 4, 2, "expected a number for 'level', found 'abc'");
        Path nav4 = file("nav4.csv", "time,lat,lon\n2026-05-14T09:15:00Z,50,-1\n2026-05-14T09:15:01Z,50.1.2,-1\n");
        fails(() -> NavigationCsvReader.read(nav4), nav4, 3, 2, "expected a number for 'lat', found '50.1.2'");
        Path nav5 = file("nav5.csv", "lat,lon,time\n50,NaN,2026-05-14T09:15:00Z\n");
        fails(() -> NavigationCsvReader.read(nav5), nav5, 2, 2, "expected a finite number for 'lon', found 'NaN'");
        Path att4 = file("att4.csv", "time,heading,heave,roll,pitch\n2026-05-14T09:15:00Z,10,0.1,1,95\n");
        fails(() -> AttitudeCsvReader.read(att4), att4, 2, 5, "expected pitch in [-90, 90] degrees, found 95");
        Path att5 = file("att5.csv", "time,heading\n2026-05-14T09:15:00Z,\n");
        fails(() -> AttitudeCsvReader.read(att5), att5, 2, 2, "expected a number for 'heading', found an empty field");
        Path wl2 = file("wl2.csv", "time,height\n2026-05-14T09:00:00Z,1.2\n");
        fails(() -> WaterLevelCsvReader.read(wl2), wl2, 1, 0, "expected a column 'level' in the header, found: time,height");
        Path wl3 = file("wl3.csv", "time,level\n2026-05-14T09:10:00Z,1.2\n2026-05-14T09:00:00Z,1.3\n");
        fails(() -> WaterLevelCsvReader.read(wl3), wl3, 3, 1, "expected times to increase strictly, found 2026-05-14T09:00:00Z after 2026-05-14T09:10:00.000Z");
        Path wl4 = file("wl4.csv", "time,level\n2026-05-14T09:10:00Z,-inf\n");
        fails(() -> WaterLevelCsvReader.read(wl4), wl4, 2, 2, "finite");
        Path dup = file("dup.csv", "time,level,LEVEL\n");
        fails(() -> WaterLevelCsvReader.read(dup), dup, 1, 3, "appears twice");
        Path quoted = file("q.csv", "time,level\n\"2026-05-14T09:10:00Z\",\"1.5\"\n");
        assertThat(WaterLevelCsvReader.read(quoted).series().value(0, 0)).isEqualTo(1.5);
        Path bom = file("bom.csv", "\uFEFFtime,level\n2026-05-14T09:10:00Z,1.5\n");
        assertThat(WaterLevelCsvReader.read(bom).size()).isEqualTo(1);
        Path empty = file("e.csv", "");
        fails(() -> WaterLevelCsvReader.read(empty), empty, 0, 0, "expected a header row");
        Path none = dir.resolve("absent.csv");
        fails(() -> WaterLevelCsvReader.read(none), none, 0, 0, "file not found");
        AttitudeSeries partial = AttitudeCsvReader.read(file("ok.csv", "time,heave\n2026-05-14T09:15:00Z,0.1\n"));
        assertThat(partial.has(AttitudeSeries.HEAVE)).isTrue();
        assertThat(partial.has(AttitudeSeries.HEADING)).isFalse();
    }
}
