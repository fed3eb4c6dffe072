package org.skyrota.web.program;

import java.util.ArrayList;
import java.util.List;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;

import org.hibernate.annotations.BatchSize;
import org.skyrota.web.system.StoredEntity;

/** An observing program: a named body of work with telescope time granted to it. */
@Entity
@Table(name = "program")
public class Program extends StoredEntity {

    @Column(nullable = false, length = 40)
    private String code;

    @Column(nullable = false, length = 200)
    private String title;

    /** User name of the person who leads the program. */
    @Column(name = "principal_investigator", nullable = false, length = 100)
    private String principalInvestigator;

    @Column(nullable = false)
    private boolean active;

    @ElementCollection
    @BatchSize(size = 64)
    @CollectionTable(name = "program_grant", joinColumns = @JoinColumn(name = "program_id"))
    @OrderColumn(name = "seq")
    private List<Grant> grants = new ArrayList<>();

    protected Program() {}

    public Program(String code, String title, String principalInvestigator) {
        this.code = code;
        this.title = title;
        this.principalInvestigator = principalInvestigator;
        this.active = true;
    }

    public String getCode() {
        return code;
    }

    public void setCode(String code) {
        this.code = code;
    }

    public String getTitle() {
        return title;
    }

    public void setTitle(String title) {
        this.title = title;
    }

    public String getPrincipalInvestigator() {
        return principalInvestigator;
    }

    public void setPrincipalInvestigator(String principalInvestigator) {
        this.principalInvestigator = principalInvestigator;
    }

    public boolean isActive() {
        return active;
    }

    public void setActive(boolean active) {
        this.active = active;
    }

    public List<Grant> getGrants() {
        return List.copyOf(grants);
    }

    public void setGrants(List<Grant> newGrants) {
        grants.clear();
        grants.addAll(newGrants);
    }
}
