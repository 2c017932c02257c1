package dev.fixmod.constellation;

/** The closed set of constellation families the kernel knows; {@link #CUSTOM} is a user's explicit point list. */
public enum Family {
    PAM("pam", "PAM"),
    PSK("psk", "PSK"),
    SQUARE_QAM("qam", "square QAM"),
    RECTANGULAR_QAM("rqam", "rectangular QAM"),
    CROSS_QAM("cqam", "cross QAM"),
    APSK("apsk", "ring (APSK) constellation"),
    PI2_BPSK("pi2bpsk", "pi/2-BPSK"),
    CUSTOM("custom", "user-defined points");

    private final String prefix;
    private final String description;

    Family(String prefix, String description) {
        this.prefix = prefix;
        this.description = description;
    }

    /** A short human description, e.g. {@code square QAM}. */
    public String description() {
        return description;
    }

    /** The name prefix used on the command line and in specifications, e.g. {@code qam} for {@code qam16}. */
    public String prefix() {
        return prefix;
    }
}
