package dev.touchstone.harness.architecture;

/** Types that {@link PositionalParametersTest} must report, or must pass, so its scan is seen to work. */
public final class WideFixtures {

    private WideFixtures() {
    }

    /** A class the scan must report. */
    public static final class Wide {
        public Wide(int a, int b, int c, int d, int e, int f) {
        }
    }

    /** A record the scan must report: its canonical constructor is public. */
    public record WideRecord(String a, String b, String c, String d, String e, String f) {
    }

    /** A class the scan must pass: five parameters, and a wide constructor that is not public. */
    public static final class Narrow {
        public Narrow(int a, int b, int c, int d, int e) {
        }

        private Narrow(int a, int b, int c, int d, int e, int f) {
        }
    }

    /** Holds a nested public type, which the scan must look into. */
    public static final class Holder {
        /** A nested class the scan must report. */
        public static final class Inner {
            public Inner(long a, long b, long c, long d, long e, long f) {
            }
        }
    }

    /** A record that is not public: its six fields are still six positions, so the scan reports it. */
    record HiddenRecord(int a, int b, int c, int d, int e, int f) {
    }

    /** Not public, so not callable from outside its package, and not a record: the scan passes it. */
    static final class PackagePrivateWide {
        public PackagePrivateWide(int a, int b, int c, int d, int e, int f) {
        }
    }
}
