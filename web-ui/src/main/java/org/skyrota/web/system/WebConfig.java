package org.skyrota.web.system;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Locale;

import org.springframework.context.annotation.Configuration;
import org.springframework.core.convert.converter.Converter;
import org.springframework.core.convert.converter.ConverterFactory;
import org.springframework.format.FormatterRegistry;
import org.springframework.web.servlet.config.annotation.InterceptorRegistry;
import org.springframework.web.servlet.config.annotation.WebMvcConfigurer;

/**
 * Query parameters name enum values in lower case, as the JSON does ({@code ?state=submitted}); dates and instants in
 * query parameters are held to {@link SupportedDates} as in bodies ({@code ?from=0000-01-01} is a 400 naming
 * {@code from}); page limits.
 */
@Configuration
class WebConfig implements WebMvcConfigurer {

    @Override
    public void addFormatters(FormatterRegistry registry) {
        registry.addConverterFactory(new LowerCaseEnums());
        // Added after Spring Boot's date formatters, so these are the ones asked first.
        registry.addConverter(String.class, LocalDate.class, text -> text.isBlank() ? null : SupportedDates.parseDate(text.trim()));
        registry.addConverter(String.class, Instant.class, text -> text.isBlank() ? null : SupportedDates.parseInstant(text.trim()));
    }

    @Override
    public void addInterceptors(InterceptorRegistry registry) {
        registry.addInterceptor(new RequestLimits.PageParameters()).addPathPatterns(RequestLimits.pagedPrefixes());
    }

    @SuppressWarnings({"rawtypes", "unchecked"})
    private static final class LowerCaseEnums implements ConverterFactory<String, Enum> {
        @Override
        public <T extends Enum> Converter<String, T> getConverter(Class<T> type) {
            return text -> text.isBlank() ? null : (T) Enum.valueOf(type, text.trim().toUpperCase(Locale.ROOT));
        }
    }
}
