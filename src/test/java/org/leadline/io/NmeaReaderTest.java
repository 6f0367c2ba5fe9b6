package org.leadline.io;

import org.leadline.io.NmeaLog.Sentence;
import org.leadline.io.NmeaProblems.Kind;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.LocalDate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;
import static org.leadline.io.NmeaLogGenerator.sentence;

/**
 * Field layouts checked against NMEA 0183 (Standard for Interfacing Marine Electronic Devices,
 * version 4.x) sentence definitions; expected values are worked by hand in this test from the field
 * text. All positions are invented.
 */
class NmeaReaderTest {

    static NmeaLog parse(LocalDate start, String eol, String... lines) {
        String text = String.join(eol, lines) + eol;
        try {
            return NmeaReader.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.ISO_8859_1)), "test.nmea", start);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static NmeaLog parse(String... lines) { return parse(null, "\n", lines); }

    static double epoch(String iso) {
        Instant i = Instant.parse(iso);
        return i.getEpochSecond() + i.getNano() * 1e-9;
    }

    static final String ZDA_0512 = sentence("GPZDA,120000.00,14,05,2026,00,00"); // 2026-05-14T12:00:00Z

    // ---------------------------------------------------------------- checksum

    @Test
    void checksumWorkedByHand() {
        // "$HEHDT,90.0,T*16": XOR of the characters between '$' and '*', worked by hand in this test.
        //  char  hex   binary      running XOR
        //  H     48    0100 1000   48
        //  E     45    0100 0101   0D  (0100 1000 ^ 0100 0101 = 0000 1101)
        //  H     48    0100 1000   45
        //  D     44    0100 0100   01
        //  T     54    0101 0100   55
        //  ,     2C    0010 1100   79
        //  9     39    0011 1001   40
        //  0     30    0011 0000   70
        //  .     2E    0010 1110   5E
        //  0     30    0011 0000   6E
        //  ,     2C    0010 1100   42
        //  T     54    0101 0100   16  (0100 0010 ^ 0101 0100 = 0001 0110)
        assertThat(NmeaReader.checksum("HEHDT,90.0,T")).isEqualTo(0x16);
        NmeaLog log = parse(ZDA_0512, "$HEHDT,90.0,T*16");
        assertThat(log.headingCount).isEqualTo(1);
        assertThat(log.heading[0]).isEqualTo(90.0);
        assertThat(log.problems().total()).isZero();

        // Second hand-worked case, "$SDDPT,2.0,0*4B": S 53, ^D 44 = 17, ^D 44 = 53, ^P 50 = 03,
        // ^T 54 = 57, ^, 2C = 7B, ^2 32 = 49, ^. 2E = 67, ^0 30 = 57, ^, 2C = 7B, ^0 30 = 4B.
        assertThat(NmeaReader.checksum("SDDPT,2.0,0")).isEqualTo(0x4B);
    }

    @Test
    void badOrMissingChecksumIsCountedNotFatal() {
        NmeaLog log = parse(ZDA_0512,
                "$HEHDT,90.0,T*17",          // line 2: wrong checksum (hand value 16)
                "$HEHDT,90.0,T",             // line 3: none
                "$HEHDT,90.0,T*1",           // line 4: one digit only
                "$HEHDT,91.0,T*17",          // line 5: right, see below
                sentence("HEHDT,92.0,T"));   // line 6: right
        // Line 5 worked by hand: "91.0" differs from "90.0" only in the character after '9',
        // 30 -> 31, which flips bit 0 of the XOR: 16 ^ 01 = 17.
        assertThat(log.problems().count(Kind.BAD_CHECKSUM)).isEqualTo(2);
        assertThat(log.problems().count(Kind.MISSING_CHECKSUM)).isEqualTo(1);
        assertThat(log.problems().examples(Kind.BAD_CHECKSUM)).extracting(NmeaProblems.Example::line)
                .containsExactly(2L, 4L);
        assertThat(log.problems().examples(Kind.BAD_CHECKSUM).get(0).detail()).contains("checksum 17, computed 16");
        assertThat(log.problems().examples(Kind.MISSING_CHECKSUM).get(0).line()).isEqualTo(3);
        assertThat(log.heading).containsExactly(91.0, 92.0);
        assertThat(log.problems().summary()).contains("2 x checksum does not match");
    }

    // ---------------------------------------------------------------- sentence types

    @Test
    void gga() {
        // NMEA 0183 4.x GGA: time, lat, N/S, lon, E/W, quality, satellites, HDOP, altitude, M, geoid sep., M, age, station
        NmeaLog log = parse(ZDA_0512, sentence("GNGGA,120001.50,5312.3456,N,00445.6789,W,4,12,0.7,3.25,M,51.2,M,1.0,0001"));
        assertThat(log.fixCount).isEqualTo(1);
        assertThat(log.fixTime[0]).isEqualTo(epoch("2026-05-14T12:00:01.500Z"));
        assertThat(log.fixLat[0]).isCloseTo(53 + 12.3456 / 60, within(1e-12));   // 53.205760
        assertThat(log.fixLon[0]).isCloseTo(-(4 + 45.6789 / 60), within(1e-12)); // -4.761315
        assertThat(log.fixQuality[0]).isEqualTo(4);
        assertThat(log.fixSatellites[0]).isEqualTo(12);
        assertThat(log.fixHdop[0]).isEqualTo(0.7);
        assertThat(log.fixAltitude[0]).isEqualTo(3.25);
        assertThat(log.fixSource(0)).isEqualTo(Sentence.GGA);
        assertThat(log.sentenceCount(Sentence.GGA)).isEqualTo(1);
    }

    @Test
    void latLonHemispheres() {
        // ddmm.mmmm / dddmm.mmmm; S and W negative (NMEA 0183 4.x field definitions). Worked by hand:
        // 4120.5000 S -> -(41 + 20.5/60) = -41.341666...; 07215.2500 W -> -(72 + 15.25/60) = -72.254166...
        // 0030.0000 N -> 0.5; 17959.9999 E -> 179 + 59.9999/60 = 179.9999983...
        NmeaLog log = parse(ZDA_0512,
                sentence("GPGGA,120001,4120.5000,S,07215.2500,W,1,08,1.0,,M,,M,,"),
                sentence("GPGGA,120002,0030.0000,N,17959.9999,E,1,08,1.0,,M,,M,,"),
                sentence("GPGGA,120003,4120.5,N,07215.25,E,1,08,1.0,,M,,M,,"));
        assertThat(log.fixLat[0]).isCloseTo(-41.341666666666667, within(1e-12));
        assertThat(log.fixLon[0]).isCloseTo(-72.254166666666667, within(1e-12));
        assertThat(log.fixLat[1]).isEqualTo(0.5);
        assertThat(log.fixLon[1]).isCloseTo(179.99999833333333, within(1e-12));
        assertThat(log.fixLat[2]).isCloseTo(41.341666666666667, within(1e-12));
        assertThat(log.fixLon[2]).isCloseTo(72.254166666666667, within(1e-12));
        assertThat(log.fixAltitude[0]).isNaN();
        // the whole-second time form hhmmss (no decimals) is accepted
        assertThat(log.fixTime[0]).isEqualTo(epoch("2026-05-14T12:00:01Z"));
    }

    @Test
    void rmc() {
        // NMEA 0183 4.x RMC: time, status, lat, N/S, lon, E/W, SOG knots, COG true, date ddmmyy, mag var, E/W, mode, nav status
        NmeaLog log = parse(sentence("GPRMC,083559.25,A,5012.0000,N,00130.0000,W,5.40,271.5,150526,1.2,W,D,S"));
        assertThat(log.fixCount).isEqualTo(1);
        assertThat(log.fixTime[0]).isEqualTo(epoch("2026-05-15T08:35:59.250Z"));
        assertThat(log.fixLat[0]).isEqualTo(50.2);
        assertThat(log.fixLon[0]).isEqualTo(-1.5);
        assertThat(log.fixQuality[0]).isEqualTo(-1);
        assertThat(log.speedCount).isEqualTo(1);
        // 5.40 kn x 1852 m / 3600 s = 2.778 m/s (international nautical mile, exact)
        assertThat(log.sog[0]).isCloseTo(2.778, within(1e-12));
        assertThat(log.cog[0]).isEqualTo(271.5);
        assertThat(log.speedSource(0)).isEqualTo(Sentence.RMC);
        // NMEA 0183 4.1 navigational status V (not valid) in field 13: the fix is not used
        NmeaLog invalid = parse(sentence("GPRMC,083559.25,A,5012.0000,N,00130.0000,W,5.40,271.5,150526,1.2,W,D,V"));
        assertThat(invalid.fixCount).isZero();
        assertThat(invalid.problems().count(Kind.NO_VALID_FIX)).isEqualTo(1);
    }

    @Test
    void rmcTwoDigitYearBefore2000() {
        // Two-digit years 80-99 read as 1980-1999 (GPS began 1980; common practice).
        NmeaLog log = parse(sentence("GPRMC,000000,A,5012.0000,N,00130.0000,W,0.0,,010199,,"));
        assertThat(log.fixTime[0]).isEqualTo(epoch("1999-01-01T00:00:00Z"));
        assertThat(log.cog[0]).isNaN();
    }

    @Test
    void gll() {
        // NMEA 0183 4.x GLL: lat, N/S, lon, E/W, time, status, mode
        NmeaLog log = parse(ZDA_0512, sentence("GPGLL,5030.1200,N,00005.4000,E,120010.00,A,A"),
                sentence("GPGLL,5030.1200,N,00005.4000,E,120011.00,V,N"));
        assertThat(log.fixCount).isEqualTo(1);
        assertThat(log.fixTime[0]).isEqualTo(epoch("2026-05-14T12:00:10Z"));
        assertThat(log.fixLat[0]).isCloseTo(50 + 30.12 / 60, within(1e-12)); // 50.502
        assertThat(log.fixLon[0]).isCloseTo(5.4 / 60, within(1e-12));        // 0.09
        assertThat(log.problems().count(Kind.NO_VALID_FIX)).isEqualTo(1);
    }

    @Test
    void zdaAndHdt() {
        // NMEA 0183 4.x ZDA: time, day, month, year, local zone hours, minutes. HDT: heading, T.
        NmeaLog log = parse(sentence("GPZDA,201530.00,29,02,2028,-03,00"), sentence("HEHDT,359.95,T"),
                sentence("HEHDT,360.0,T"));
        assertThat(log.headingTime[0]).isEqualTo(epoch("2028-02-29T20:15:30Z"));
        assertThat(log.heading).containsExactly(359.95, 0.0);
    }

    @Test
    void vtgBothForms() {
        // NMEA 0183 4.x VTG: COG true, T, COG magnetic, M, SOG knots, N, SOG km/h, K, mode
        // and the pre-2.0 form: COG true, COG magnetic, SOG knots, SOG km/h.
        NmeaLog log = parse(ZDA_0512,
                sentence("GPVTG,054.7,T,034.4,M,005.5,N,010.2,K,A"),
                sentence("GPVTG,054.7,034.4,005.5,010.2"),
                sentence("GPVTG,,T,,M,,N,36.0,K,A"));
        assertThat(log.speedCount).isEqualTo(3);
        assertThat(log.cog[0]).isEqualTo(54.7);
        assertThat(log.sog[0]).isCloseTo(5.5 * 1852 / 3600, within(1e-12)); // 2.829444 m/s
        assertThat(log.cog[1]).isEqualTo(54.7);
        assertThat(log.sog[1]).isCloseTo(5.5 * 1852 / 3600, within(1e-12));
        assertThat(log.cog[2]).isNaN();
        assertThat(log.sog[2]).isCloseTo(10.0, within(1e-12));              // 36 km/h = 10 m/s
        assertThat(log.speedTime[2]).isEqualTo(epoch("2026-05-14T12:00:00Z"));
    }

    @Test
    void dbtMetresPreferredThenFeetThenFathoms() {
        // NMEA 0183 4.x DBT: depth feet, f, depth metres, M, depth fathoms, F
        NmeaLog log = parse(ZDA_0512,
                sentence("SDDBT,41.0,f,12.50,M,6.8,F"),
                sentence("SDDBT,41.0,f,,M,,F"),     // feet only: 41 x 0.3048 = 12.4968 m
                sentence("SDDBT,,f,,M,6.5,F"),      // fathoms only: 6.5 x 1.8288 = 11.8872 m
                sentence("SDDBT,,f,,M,,F"));        // no bottom
        assertThat(log.depthCount).isEqualTo(3);
        assertThat(log.depthBelowTransducer[0]).isEqualTo(12.50);
        assertThat(log.depthBelowTransducer[1]).isCloseTo(12.4968, within(1e-12));
        assertThat(log.depthBelowTransducer[2]).isCloseTo(11.8872, within(1e-12));
        assertThat(log.dptOffset[0]).isNaN();
        assertThat(log.depthSource(0)).isEqualTo(Sentence.DBT);
        assertThat(log.problems().count(Kind.EMPTY_VALUE)).isEqualTo(1);
        assertThat(log.problems().examples(Kind.EMPTY_VALUE).get(0).line()).isEqualTo(5);
    }

    @Test
    void dptKeepsRawDepthAndOffset() {
        // NMEA 0183 4.x DPT: depth relative to transducer (m), offset (m; + to waterline, - to keel), max range
        NmeaLog log = parse(ZDA_0512, sentence("SDDPT,12.40,0.50,100"), sentence("SDDPT,8.05,-1.20"),
                sentence("SDDPT,3.3,"));
        assertThat(log.depthBelowTransducer).containsExactly(12.40, 8.05, 3.3);
        assertThat(log.dptOffset[0]).isEqualTo(0.50);
        assertThat(log.dptOffset[1]).isEqualTo(-1.20);
        assertThat(log.dptOffset[2]).isNaN();
        assertThat(log.depthSource(1)).isEqualTo(Sentence.DPT);
        assertThat(log.depthTime[0]).isEqualTo(epoch("2026-05-14T12:00:00Z"));
    }

    @Test
    void otherProblemsAreCountedAndSkipped() {
        NmeaLog log = parse(ZDA_0512,
                "junk from the logger",                                              // 2 not NMEA
                sentence("GPGSV,1,1,01,03,03,111,00"),                               // 3 unknown type
                sentence("PGRME,15.0,M,45.0,M,25.0,M"),                              // 4 proprietary
                "!" + sentence("AIVDM,1,1,,A,13aEOK?P00PD2wVMdLDRhgvL289?,0").substring(1), // 5 encapsulated
                sentence("GPGGA,120001,53x2.3456,N,00445.6789,W,1,09,0.9,1.2,M,,M,,"), // 6 malformed lat
                sentence("GPGGA,120001,5372.3456,N,00445.6789,W,1,09,0.9,1.2,M,,M,,"), // 7 minutes >= 60
                sentence("GPGGA,250001,5312.3456,N,00445.6789,W,1,09,0.9,1.2,M,,M,,"), // 8 hour 25
                sentence("GPGGA,120001,5312.3456,X,00445.6789,W,1,09,0.9,1.2,M,,M,,"), // 9 hemisphere
                sentence("GPGGA,120001,,,,,0,00,99.9,,M,,M,,"),                        // 10 no fix
                sentence("GPRMC,120001,V,,,,,,,140526,,,N"),                           // 11 void
                sentence("GPZDA,120002,31,02,2026,00,00"),                             // 12 not a date
                sentence("SDDPT,-1.0,0.5"),                                            // 13 negative depth
                sentence("HEHDT,361.0,T"),                                             // 14 heading range
                sentence("SDDBT,,f,12.0,M,,F"));                                       // 15 good
        NmeaProblems p = log.problems();
        assertThat(p.count(Kind.NOT_NMEA)).isEqualTo(1);
        assertThat(p.count(Kind.UNKNOWN_TYPE)).isEqualTo(3);
        assertThat(p.count(Kind.MALFORMED_FIELD)).isEqualTo(7);
        assertThat(p.count(Kind.NO_VALID_FIX)).isEqualTo(2);
        assertThat(p.total()).isEqualTo(13);
        assertThat(p.examples(Kind.MALFORMED_FIELD)).extracting(NmeaProblems.Example::line)
                .containsExactly(6L, 7L, 8L, 9L, 12L);  // first five kept
        assertThat(p.examples(Kind.MALFORMED_FIELD).get(0).detail())
                .contains("field 2 (latitude): expected ddmm.mmmm, found '53x2.3456'");
        assertThat(log.fixCount).isZero();
        assertThat(log.depthCount).isEqualTo(1);
        assertThat(log.depthBelowTransducer[0]).isEqualTo(12.0);
    }

    @Test
    void untimedSentencesBeforeAnyTimeAreCounted() {
        NmeaLog log = parse(sentence("SDDBT,,f,12.0,M,,F"), ZDA_0512, sentence("SDDBT,,f,13.0,M,,F"));
        assertThat(log.problems().count(Kind.BEFORE_FIRST_TIME)).isEqualTo(1);
        assertThat(log.depthBelowTransducer).containsExactly(13.0);
    }

    // ---------------------------------------------------------------- time

    @Test
    void midnightRollover() {
        NmeaLog log = parse(
                sentence("GPZDA,235959.00,31,12,2026,00,00"),
                sentence("GPGGA,235959.50,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,"),
                sentence("SDDBT,,f,10.0,M,,F"),
                sentence("GPGGA,000000.50,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,"),
                sentence("SDDBT,,f,10.1,M,,F"),
                sentence("GPGGA,235959.90,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,"), // late, out of order
                sentence("GPGGA,000001.50,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,"));
        assertThat(log.depthTime[0]).isEqualTo(epoch("2026-12-31T23:59:59.500Z"));
        assertThat(log.depthTime[1]).isEqualTo(epoch("2027-01-01T00:00:00.500Z"));
        assertThat(log.fixTime).containsExactly(epoch("2026-12-31T23:59:59.500Z"), epoch("2027-01-01T00:00:00.500Z"),
                epoch("2026-12-31T23:59:59.900Z"), epoch("2027-01-01T00:00:01.500Z"));
        // the navigation series is in time order
        assertThat(log.navigationTimes()).isSorted();
    }

    @Test
    void sentencesBeforeTheFirstDateAreDatedBackwardsFromIt() {
        NmeaLog log = parse(
                sentence("GPGGA,235958.00,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,"),
                sentence("SDDBT,,f,10.0,M,,F"),
                sentence("GPGGA,000000.00,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,"),
                sentence("GPZDA,000000.50,15,05,2026,00,00"),
                sentence("HEHDT,10.0,T"));
        assertThat(log.fixTime).containsExactly(epoch("2026-05-14T23:59:58Z"), epoch("2026-05-15T00:00:00Z"));
        assertThat(log.depthTime[0]).isEqualTo(epoch("2026-05-14T23:59:58Z"));
        assertThat(log.headingTime[0]).isEqualTo(epoch("2026-05-15T00:00:00.500Z"));
    }

    @Test
    void noDateIsAnErrorUnlessAStartDateIsGiven() {
        String gga = sentence("GPGGA,235959.00,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,");
        String gga2 = sentence("GPGGA,000001.00,5312.0000,N,00445.0000,W,1,09,0.9,1.2,M,,M,,");
        assertThatThrownBy(() -> parse(gga, gga2))
                .isInstanceOf(InputException.class)
                .hasMessage("test.nmea: no date: the log has no ZDA or RMC sentence; give the survey date");
        NmeaLog log = parse(LocalDate.of(2026, 5, 14), "\n", gga, gga2);
        assertThat(log.fixTime).containsExactly(epoch("2026-05-14T23:59:59Z"), epoch("2026-05-15T00:00:01Z"));
        assertThat(log.problems().total()).isZero();
    }

    @Test
    void logDateWinsOverAStartDateAndTheDifferenceIsReported() {
        NmeaLog log = parse(LocalDate.of(2026, 5, 13), "\n", ZDA_0512, sentence("HEHDT,10.0,T"));
        assertThat(log.headingTime[0]).isEqualTo(epoch("2026-05-14T12:00:00Z"));
        assertThat(log.problems().count(Kind.START_DATE_DIFFERS)).isEqualTo(1);
        assertThat(log.problems().examples(Kind.START_DATE_DIFFERS).get(0).detail())
                .contains("2026-05-14").contains("2026-05-13");
    }

    // ---------------------------------------------------------------- line handling

    @Test
    void lineEndsBomAndBlankLines() throws IOException {
        String[] lines = {ZDA_0512, "", sentence("SDDBT,,f,12.0,M,,F"), "  ", "$BAD", sentence("SDDBT,,f,13.0,M,,F") + "  "};
        for (String eol : new String[]{"\n", "\r\n", "\r"}) {
            String text = "\uFEFF" + String.join(eol, lines); // BOM; no final line end
            NmeaLog log = NmeaReader.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), "t", null);
            assertThat(log.depthBelowTransducer).as(eol.replace("\r", "CR").replace("\n", "LF")).containsExactly(12.0, 13.0);
            assertThat(log.problems().total()).isEqualTo(1);
            assertThat(log.problems().examples(Kind.MISSING_CHECKSUM).get(0).line()).isEqualTo(5);
        }
    }
}
