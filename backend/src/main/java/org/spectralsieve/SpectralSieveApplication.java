package org.spectralsieve;

import org.spectralsieve.cli.SieveCli;
import org.springframework.boot.SpringApplication;
import org.springframework.boot.autoconfigure.SpringBootApplication;
import org.springframework.boot.context.properties.ConfigurationPropertiesScan;

/** Starts the web service; the same jar also answers command-line calls (see {@code cli}). */
@SpringBootApplication
@ConfigurationPropertiesScan
public class SpectralSieveApplication {

    public static void main(String[] args) {
        if (SieveCli.handles(args)) {
            System.exit(SieveCli.run(args, System.out, System.err));
        }
        SpringApplication.run(SpectralSieveApplication.class, args);
    }
}
