import org.leadline.watercolumn.PressureDepth;
import org.leadline.watercolumn.Pss78;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Writes the invented estuarine CTD cast used by the command-line tests (src/test/resources/casts/
 * estuary-ctd.csv). The water is made up: a warm brackish surface layer over a cold salty bottom layer
 * (S 6 -> 28, T 17.5 -> 12 deg C ITS-90), with a soak, a downcast to 24 m and an upcast. Pressure and
 * conductivity come from Leadline's own equations (UNESCO 1983 pressure from depth, PSS-78 inverse).
 *
 *   mvn -q -o compile && java -cp target/classes scripts/testdata/MakeEstuaryCast.java > src/test/resources/casts/estuary-ctd.csv
 */
public class MakeEstuaryCast {
    static final double LAT = 53.55;

    static double temperature(double z) { return 17.5 - 5.5 / (1 + Math.exp(-(z - 6) / 1.5)); }
    static double salinity(double z) { return 6 + 22 / (1 + Math.exp(-(z - 5) / 1.2)); }

    public static void main(String[] args) {
        List<Double> z = new ArrayList<>();
        for (double d = 0.3; d < 3; d += 0.3) z.add(d);                       // lowered to soak
        for (int i = 0; i < 20; i++) z.add(3 + 0.02 * Math.sin(i));            // soak at 3 m
        for (double d = 2.6; d > 0.5; d -= 0.4) z.add(d);                     // raised
        for (int i = 0; i < 5; i++) z.add(0.4 + 0.01 * Math.cos(i));          // waiting below the surface
        for (int i = 1; i <= 118; i++) z.add(0.4 + 0.2 * i + 0.03 * Math.sin(3 * i)); // downcast to ~24 m
        for (double d = 23.5; d >= 1; d -= 0.5) z.add(d);                     // upcast
        StringBuilder sb = new StringBuilder();
        sb.append("# Invented estuarine CTD cast for tests (scripts/testdata/MakeEstuaryCast.java)\n");
        sb.append("# name: estuary-ctd-01\n# time: 2026-05-14T09:10:00Z\n# lat: ").append(LAT).append("\n# lon: 9.95\n");
        sb.append("# temperature_scale: ITS-90\n");
        sb.append("scan,Pressure,Temperature,Conductivity\n");
        int scan = 0;
        for (double d : z) {
            double t = temperature(d), s = salinity(d);
            double p = PressureDepth.pressure(d, LAT);
            double c = Pss78.conductivityFromSalinity(s, t, p);
            sb.append(String.format(Locale.ROOT, "%d,%.3f,%.4f,%.4f%n", scan++, p, t, c));
        }
        System.out.print(sb);
    }
}
