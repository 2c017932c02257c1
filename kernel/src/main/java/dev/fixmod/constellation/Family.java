package dev.fixmod.constellation;

/** The closed set of constellation families the kernel knows; {@link #CUSTOM} is a user's explicit point list. */
public enum Family {
    PAM("pam"),
    PSK("psk"),
    SQUARE_QAM("qam"),
    RECTANGULAR_QAM("rqam"),
    CROSS_QAM("cqam"),
    APSK("apsk"),
    PI2_BPSK("pi2bpsk"),
    CUSTOM("custom");

    private final String prefix;

    Family(String prefix) {
        this.prefix = prefix;
    }

    /** The name prefix used on the command line and in specifications, e.g. {@code qam} for {@code qam16}. */
    public String prefix() {
        return prefix;
    }
}
