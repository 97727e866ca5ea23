package org.spectralsieve.accounts;

import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;

/** An account or token request that cannot be carried out: an RFC 9457 problem naming the field. */
@RestControllerAdvice
@Order(Ordered.HIGHEST_PRECEDENCE)
class AccountProblems {

    @ExceptionHandler(AccountRequestException.class)
    ResponseEntity<ProblemDetail> refused(AccountRequestException e) {
        HttpStatus status = HttpStatus.valueOf(e.status());
        ProblemDetail problem = ProblemDetail.forStatusAndDetail(status, e.getMessage());
        problem.setTitle(status.value() == 409 ? "Conflicts with an existing account"
                : status.value() == 404 ? "Not found" : "Account request refused");
        problem.setProperty("field", e.field());
        return ResponseEntity.status(status).body(problem);
    }
}
