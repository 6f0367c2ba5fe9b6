package org.leadline.io;

import org.leadline.io.NmeaLog.Sentence;
import org.leadline.io.NmeaProblems.Kind;
import org.leadline.survey.PingTable;
import org.junit.jupiter.api.Test;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.leadline.io.NmeaLogGenerator.sentence;
import static org.leadline.io.NmeaReaderTest.epoch;
import static org.leadline.io.NmeaReaderTest.parse;

/** Conversion of a read log into pings and a navigation series; expected values worked by hand. */
class NmeaLogTest {

    static String gga(String hms, String lat, String lon) {
        return sentence("GPGGA," + hms + "," + lat + ",N," + lon + ",W,1,09,0.9,1.2,M,,M,,");
    }

    @Test
    void toPingTableInterpolatesPositionAndHeading() {
        // Fix A 12:00:00 at 5312.0000N 00445.0000W = (53.2, -4.75); fix B 12:00:01 at 5312.0600N
        // 00445.1200W = (53.201, -4.752). ZDA sentences at .25 and .50 give the depths their stamps.
        NmeaLog log = parse(
                sentence("GPZDA,115959.50,14,05,2026,00,00"),
                sentence("SDDBT,,f,9.90,M,,F"),                  // 11:59:59.5, before the first fix
                gga("120000.00", "5312.0000", "00445.0000"),
                sentence("HEHDT,359.0,T"),                       // heading at 12:00:00
                sentence("GPZDA,120000.25,14,05,2026,00,00"),
                sentence("SDDBT,,f,10.00,M,,F"),                 // 12:00:00.25
                sentence("GPZDA,120000.50,14,05,2026,00,00"),
                sentence("SDDBT,,f,10.10,M,,F"),                 // 12:00:00.50
                gga("120001.00", "5312.0600", "00445.1200"),
                sentence("HEHDT,1.0,T"),                         // heading at 12:00:01
                sentence("SDDBT,,f,10.20,M,,F"),                 // 12:00:01, at fix B
                sentence("GPZDA,120002.50,14,05,2026,00,00"),
                sentence("SDDBT,,f,10.30,M,,F"));                // 12:00:02.5, after the last fix
        PingTable p = log.toPingTable("L1");
        assertThat(p.size).isEqualTo(5);
        assertThat(p.lineName(0)).isEqualTo("L1");
        assertThat(p.depth).containsExactly(9.90, 10.00, 10.10, 10.20, 10.30);
        assertThat(p.time[1]).isEqualTo(epoch("2026-05-14T12:00:00.250Z"));
        // outside the fix record: NaN
        assertThat(p.lat[0]).isNaN();
        assertThat(p.lon[4]).isNaN();
        // a quarter of the way: 53.2 + 0.25 x 0.001 = 53.20025; -4.75 - 0.25 x 0.002 = -4.7505
        assertThat(p.lat[1]).isCloseTo(53.20025, within(1e-9));
        assertThat(p.lon[1]).isCloseTo(-4.7505, within(1e-9));
        // half way: (53.2005, -4.751)
        assertThat(p.lat[2]).isCloseTo(53.2005, within(1e-9));
        assertThat(p.lon[2]).isCloseTo(-4.751, within(1e-9));
        assertThat(p.lat[3]).isCloseTo(53.201, within(1e-12));
        // heading 359 -> 1 over one second passes through north: 0.25 s gives 359.5, 0.5 s gives 0
        assertThat(p.heading[1]).isCloseTo(359.5, within(1e-9));
        assertThat(p.heading[2]).isCloseTo(0.0, within(1e-9));
        assertThat(p.heading[3]).isEqualTo(1.0);
        // 1.5 s after the last HDT: no heading
        assertThat(p.heading[4]).isNaN();
        // 0.5 s before the first HDT: the nearest within 1 s
        assertThat(p.heading[0]).isEqualTo(359.0);
        assertThat(p.twtt[0]).isNaN();
        assertThat(p.quality[0]).isEqualTo(-1);
    }

    @Test
    void headingNearestWithinOneSecondOtherwiseNaN() {
        NmeaLog log = parse(sentence("GPZDA,120000.00,14,05,2026,00,00"), sentence("HEHDT,90.0,T"),
                sentence("GPZDA,120005.00,14,05,2026,00,00"), sentence("HEHDT,100.0,T"));
        double t0 = epoch("2026-05-14T12:00:00Z");
        assertThat(log.headingAt(t0 + 0.9)).isEqualTo(90.0);    // only the earlier sample is within 1 s
        assertThat(log.headingAt(t0 + 2.5)).isNaN();            // 2.5 s from both: a gap, no heading
        assertThat(log.headingAt(t0 + 4.2)).isEqualTo(100.0);
        assertThat(log.headingAt(t0 - 1.5)).isNaN();
    }

    @Test
    void longitudeInterpolatesAcrossTheAntimeridian() {
        // 17959.4000 E = 179.99, 17959.4000 W = -179.99: half way is 180 (written -180), not 0.
        NmeaLog log = parse(sentence("GPZDA,120000.00,14,05,2026,00,00"),
                sentence("GPGGA,120000,1000.0000,S,17959.4000,E,1,09,0.9,,M,,M,,"),
                sentence("GPGGA,120002,1000.0000,S,17959.4000,W,1,09,0.9,,M,,M,,"));
        double[] pos = log.positionAt(epoch("2026-05-14T12:00:01Z"), new double[2]);
        assertThat(pos[0]).isCloseTo(-10.0, within(1e-12));
        assertThat(Math.abs(pos[1])).isCloseTo(180.0, within(1e-9));
        pos = log.positionAt(epoch("2026-05-14T12:00:00.5Z"), pos);
        assertThat(pos[1]).isCloseTo(179.995, within(1e-9));
    }

    @Test
    void navigationSeriesKeepsOneFixPerStampPreferringGga() {
        NmeaLog log = parse(
                sentence("GPRMC,120000,A,5312.0000,N,00445.0000,W,1.0,90.0,140526,,,A"),
                sentence("GPGGA,120000,5312.0010,N,00445.0000,W,1,09,0.9,,M,,M,,"),
                sentence("GPGLL,5312.0600,N,00445.0000,W,120001,A,A"));
        assertThat(log.fixCount).isEqualTo(3);
        assertThat(log.navigationTimes()).containsExactly(epoch("2026-05-14T12:00:00Z"), epoch("2026-05-14T12:00:01Z"));
        assertThat(log.navigationLat()[0]).isCloseTo(53 + 12.001 / 60, within(1e-12)); // the GGA one
        assertThat(log.lat()[1]).isCloseTo(53.201, within(1e-12));
        assertThat(log.lon()).containsExactly(-4.75, -4.75);
    }

    @Test
    void pingsComeFromDptWhenTheLogHasBoth() {
        NmeaLog log = parse(sentence("GPZDA,120000.00,14,05,2026,00,00"),
                sentence("SDDPT,12.40,0.50"), sentence("SDDBT,40.7,f,12.40,M,6.8,F"));
        assertThat(log.depthCount).isEqualTo(2);
        assertThat(log.pingDepthSource()).isEqualTo(Sentence.DPT);
        assertThat(log.toPingTable("x").depth).containsExactly(12.40);
        NmeaLog dbtOnly = parse(sentence("GPZDA,120000.00,14,05,2026,00,00"), sentence("SDDBT,40.7,f,12.40,M,6.8,F"));
        assertThat(dbtOnly.toPingTable("x").size).isEqualTo(1);
    }

    /** The committed log is exactly what the generator writes, so it can be regenerated and trusted. */
    @Test
    void committedLogMatchesItsGenerator() throws IOException {
        Path file = Path.of("src/test/resources/nmea/line-midnight.nmea");
        assertThat(Files.readAllLines(file, StandardCharsets.US_ASCII))
                .isEqualTo(NmeaLogGenerator.lines(NmeaLogGenerator.START, NmeaLogGenerator.SECONDS, true));
    }

    @Test
    void committedLogAcrossMidnight() throws IOException {
        NmeaLog log = NmeaReader.read(Path.of("src/test/resources/nmea/line-midnight.nmea"));
        int n = NmeaLogGenerator.SECONDS;
        // per second: GGA, HDT, VTG, 2 x (DPT, DBT); every 5 s from second 3: ZDA and RMC
        assertThat(log.sentenceCount(Sentence.GGA)).isEqualTo(n);
        assertThat(log.sentenceCount(Sentence.ZDA)).isEqualTo(12);
        assertThat(log.sentenceCount(Sentence.RMC)).isEqualTo(12);
        assertThat(log.depthCount).isEqualTo(4 * n);
        assertThat(log.problems().count(Kind.BAD_CHECKSUM)).isEqualTo(1);
        assertThat(log.problems().count(Kind.MISSING_CHECKSUM)).isEqualTo(1);
        assertThat(log.problems().count(Kind.UNKNOWN_TYPE)).isEqualTo(1);
        assertThat(log.problems().count(Kind.NOT_NMEA)).isEqualTo(1);
        assertThat(log.problems().total()).isEqualTo(4);

        PingTable p = log.toPingTable("L-midnight");
        assertThat(p.size).isEqualTo(2 * n);                   // DPT only
        // first pings (before the first ZDA, dated backwards): 2026-05-14T23:59:30Z
        assertThat(p.time[0]).isEqualTo(epoch("2026-05-14T23:59:30Z"));
        assertThat(p.time[2 * n - 1]).isEqualTo(epoch("2026-05-15T00:00:29Z"));
        assertThat(p.time).isSorted();
        for (int i = 0; i < p.size; i++) {
            int s = i / 2;
            assertThat(p.depth[i]).isEqualTo(NmeaLogGenerator.depth(s, i % 2));
            double[] pos = NmeaLogGenerator.position(s);
            // the file carries 0.0001' = 0.185 m resolution
            assertThat(p.lat[i]).isCloseTo(pos[0], within(0.00005 / 60));
            assertThat(p.lon[i]).isCloseTo(pos[1], within(0.00005 / 60));
            assertThat(p.heading[i]).isCloseTo(45.0 + 0.1 * (s % 10), within(1e-9));
        }
        // VTG and RMC speeds: 3.89 kn written for 2 m/s (3.8877 kn)
        for (int i = 0; i < log.speedCount; i++) assertThat(log.sog[i]).isCloseTo(2.0, within(0.01));
        assertThat(log.summary()).contains("GGA 60").contains("240 depths").contains("4 problem lines")
                .contains("line 82: $SDDBT,65.6,f,20.00,M,10.9,F*00 : checksum 00, computed 09");
    }
}
